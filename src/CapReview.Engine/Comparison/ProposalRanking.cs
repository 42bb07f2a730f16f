using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Factors;
using CapReview.Engine.Rates;

namespace CapReview.Engine.Comparison;

/// <summary>One proposal to rank: its validated model, the MARR it is judged at and, for a study period, its value at the end.</summary>
/// <param name="Id">The proposal's reference.</param>
/// <param name="Model">The validated cash-flow model; its horizon is the life.</param>
/// <param name="Marr">The policy's MARR for its risk class, or its documented override.</param>
/// <param name="ValueAtStudyEnd">Market value at the end of a study period shorter than the life, or the stated value of the renewal in service at the end of a longer one.</param>
/// <param name="CapitalFrom">The model whose capital outlays the budget counts when <paramref name="Model"/> is not it (after-tax flows); null for the model itself.</param>
public sealed record RankingEntry(string Id, CashFlowModel Model, AnnualRate Marr, double? ValueAtStudyEnd = null, CashFlowModel? CapitalFrom = null);

/// <summary>A ranked proposal: every measure at its MARR, and the annual and present worth on the board's common basis.</summary>
/// <param name="Id">The proposal's reference.</param>
/// <param name="Rank">1 for the highest annual worth.</param>
/// <param name="Evaluation">Every measure over the proposal's own life.</param>
/// <param name="AnnualWorth">Equivalent worth per year on the ranking's basis.</param>
/// <param name="PresentWorth">Present worth on the ranking's basis: over the life, or over the study period.</param>
/// <param name="Basis">How the life was put on the common basis, in words.</param>
/// <param name="LaterCapital">Capital outlays in budget years 1, 2, … of the life (year 0 is the first cost).</param>
/// <param name="FirstCost">The outlay now (positive).</param>
public sealed record RankedProposal(
    string Id,
    int Rank,
    Evaluation.Evaluation Evaluation,
    double AnnualWorth,
    double PresentWorth,
    string Basis,
    IReadOnlyList<double> LaterCapital,
    double FirstCost)
{
    public double LifeYears => Evaluation.Model.Years;
}

/// <summary>
/// Ranks proposals by annual worth, which compares unequal lives fairly. With no study period each proposal's annual
/// worth over its own life stands (the repeatability assumption: a like-for-like renewal at the end of each life);
/// with a study period of T years each proposal's present worth over T (truncated at its market value, or renewed with
/// a stated value at the end) is spread over T at its MARR. Common practice, no source; see docs/methods.md.
/// </summary>
public static class ProposalRanking
{
    public const string Repeatability = "annual worth over its own life, renewed like for like (repeatability)";

    /// <param name="entries">The proposals, each with its model and MARR.</param>
    /// <param name="studyPeriodYears">A board-set study period in whole years, or null for repeatability.</param>
    /// <param name="marrShift">Effective annual points added to every proposal's MARR (a what-if; 0 for the cycle's).</param>
    /// <exception cref="ArgumentException">An entry cannot be evaluated on the ranking's basis (see <see cref="RankEvaluable"/>).</exception>
    public static IReadOnlyList<RankedProposal> Rank(IReadOnlyList<RankingEntry> entries, int? studyPeriodYears = null, double marrShift = 0.0)
    {
        RankingOutcome outcome = RankEvaluable(entries, studyPeriodYears, marrShift);
        if (outcome.Unevaluable.Count > 0)
        {
            throw new ArgumentException($"{outcome.Unevaluable[0].Id}: {outcome.Unevaluable[0].Reason}", nameof(entries));
        }
        return outcome.Ranked;
    }

    /// <summary>
    /// The ranking of the entries that can be evaluated on the ranking's basis, and each that cannot with the reason:
    /// a MARR that the shift moves out of (−100%, 1000%], or a worth past every double at it. One such entry never stops
    /// the others being ranked.
    /// </summary>
    public static RankingOutcome RankEvaluable(IReadOnlyList<RankingEntry> entries, int? studyPeriodYears = null, double marrShift = 0.0)
    {
        ArgumentNullException.ThrowIfNull(entries);
        if (studyPeriodYears is < 1 or > 100)
        {
            throw new ArgumentOutOfRangeException(nameof(studyPeriodYears), studyPeriodYears, "A study period is 1 to 100 years.");
        }
        var ranked = new List<(RankingEntry Entry, Evaluation.Evaluation Evaluation, double AnnualWorth, double PresentWorth, string Basis)>(entries.Count);
        var unevaluable = new List<UnevaluableEntry>();
        foreach (RankingEntry entry in entries)
        {
            double shifted = entry.Marr.EffectiveAnnual() + marrShift;
            if (marrShift != 0.0 && AnnualRate.Check(shifted, RateBasis.Effective, 1, "rate").Count > 0)
            {
                unevaluable.Add(new(entry.Id, string.Create(CultureInfo.InvariantCulture,
                    $"its MARR shifted by {marrShift * 100:+0.##;-0.##} points, {shifted * 100:0.##}% a year, is outside −100% … 1000%")));
                continue;
            }
            AnnualRate marr = marrShift == 0.0 ? entry.Marr : AnnualRate.Effective(shifted);
            var evaluated = ModelEvaluator.TryEvaluate(entry.Model, new EvaluationOptions(marr));
            if (evaluated.Value is not { } evaluation)
            {
                unevaluable.Add(new(entry.Id, evaluated.Errors[0].Message));
                continue;
            }
            var row = studyPeriodYears is int years
                ? OverStudyPeriod(entry, evaluation, years)
                : (entry, evaluation, evaluation.AnnualWorth, evaluation.PresentWorth, Repeatability);
            if (!double.IsFinite(row.Item3) || !double.IsFinite(row.Item4))
            {
                unevaluable.Add(new(entry.Id, $"its worth over the study period is {UnavailableMeasures.BeyondRange}"));
                continue;
            }
            ranked.Add(row);
        }
        return new RankingOutcome([.. ranked
            .OrderByDescending(r => r.AnnualWorth)
            .ThenBy(r => r.Entry.Id, StringComparer.Ordinal)
            .Select((r, index) => new RankedProposal(r.Entry.Id, index + 1, r.Evaluation, r.AnnualWorth, r.PresentWorth, r.Basis,
                LaterCapital(r.Entry.CapitalFrom ?? r.Entry.Model), Math.Max(0.0, -(r.Entry.CapitalFrom ?? r.Entry.Model).NetFlows[0])))],
            unevaluable);
    }

    /// <summary>Capital outlays per budget year: year k holds periods in (k − 1, k] years; year 0 is period 0 alone.</summary>
    public static IReadOnlyList<double> LaterCapital(CashFlowModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        int p = model.PeriodsPerYear;
        var byYear = new double[(model.Horizon + p - 1) / p];
        for (int e = 0; e < model.Elements.Count; e++)
        {
            if (model.Elements[e].Category != CashFlowCategory.Capital)
            {
                continue;
            }
            double[] flows = model.FlowsOf(e);
            for (int t = 1; t < flows.Length; t++)
            {
                byYear[(t + p - 1) / p - 1] -= flows[t];
            }
        }
        return [.. byYear.Select(v => Math.Max(0.0, v))];
    }

    private static (RankingEntry, Evaluation.Evaluation, double, double, string) OverStudyPeriod(RankingEntry entry, Evaluation.Evaluation evaluation, int years)
    {
        int p = entry.Model.PeriodsPerYear;
        var result = StudyPeriodWorth.Compute(entry.Model, evaluation.MarrPerPeriod, years * p, entry.ValueAtStudyEnd ?? 0.0);
        double perYear = result.PeriodWorth * CompoundInterest.UniformSeriesCompoundAmount(evaluation.MarrPerPeriod, p);
        bool needsValue = years * p % entry.Model.Horizon != 0;
        string basis = needsValue && entry.ValueAtStudyEnd is null
            ? $"study period of {years} years: {result.Basis}, no value stated, taken as zero"
            : $"study period of {years} years: {result.Basis}";
        return (entry, evaluation, perYear, result.PresentWorth, basis);
    }
}
