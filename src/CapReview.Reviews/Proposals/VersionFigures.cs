using CapReview.Engine.Comparison;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Measures;
using CapReview.Engine.Validation;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Risk;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Every figure a version's record states, computed once by the domain at the board's terms: the measures, the flows
/// period by period and element by element, the worth over the cycle's study period, the after-tax evaluation with its
/// depreciation schedule, the version's changes from the ones before it, and (where it has risk settings) its
/// sensitivity and simulation. The packets and the exports lay these out; neither computes a figure of its own.
/// </summary>
/// <param name="Evaluation">Every measure at the board's MARR; null when the model is not complete.</param>
/// <param name="Profile">The present worth at annual rates around the rates of return, for the profile chart.</param>
/// <param name="Periods">The flows of each period with their discounting; empty without an evaluation.</param>
/// <param name="ElementWorths">Each element's present worth, in the model's order; empty without an evaluation.</param>
/// <param name="StudyPeriod">The worth over the cycle's study period, when the board set one.</param>
/// <param name="AfterTax">The after-tax evaluation, or why it cannot be made; null without tax settings.</param>
/// <param name="Depreciation">The depreciation schedule to the disposal year, with a complete after-tax evaluation.</param>
/// <param name="Changes">The changes from each earlier version to the next, up to this one.</param>
/// <param name="Risk">The risk study, or why it cannot be made; null without risk settings.</param>
/// <param name="Sensitivity">Tornado, spider, break-even values and scenarios, with a complete risk study.</param>
/// <param name="Simulation">The seeded simulation's summary, with a complete risk study.</param>
public sealed record VersionFigures(
    Evaluation? Evaluation,
    IReadOnlyList<ProfilePoint> Profile,
    IReadOnlyList<PeriodRow> Periods,
    IReadOnlyList<double> ElementWorths,
    RankedProposal? StudyPeriod,
    Outcome<AfterTaxEvaluation>? AfterTax,
    DepreciationSchedule? Depreciation,
    IReadOnlyList<VersionDifference> Changes,
    Outcome<RiskStudy>? Risk,
    SensitivityResult? Sensitivity,
    SimulationSummary? Simulation)
{
    /// <summary>
    /// Why there are no measures, when <see cref="Evaluation"/> is null: the first field the model is refused on, and
    /// why (a model not complete, or a MARR at which its worth cannot be computed).
    /// </summary>
    public string? WhyNoMeasures { get; init; }

    /// <summary>The capital outlays after year 0 depreciated as assets of their own, with a complete after-tax evaluation.</summary>
    public OutlayAssets? Outlays { get; init; }

    /// <summary>
    /// The figures of <paramref name="version"/> of <paramref name="proposal"/> under <paramref name="policy"/>, over
    /// <paramref name="studyPeriodYears"/> where the cycle has a study period. The simulation runs only when asked.
    /// </summary>
    public static VersionFigures Of(ProposalView proposal, VersionView version, MarrPolicyVersion policy, int? studyPeriodYears, bool simulate,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(version);
        ArgumentNullException.ThrowIfNull(policy);
        Outcome<Evaluation> evaluated = Evaluator.Evaluate(ProposalTerms.Model(version.Assumptions, policy, proposal.RiskClass));
        Evaluation? evaluation = evaluated.Value;
        RankedProposal? study = evaluation is not null && studyPeriodYears is int years
            ? ProposalRanking.RankEvaluable([new RankingEntry(proposal.Reference, evaluation.Model, evaluation.Marr, version.Assumptions.ValueAtStudyEnd)], years).Ranked is [var ranked] ? ranked : null
            : null;
        Outcome<AfterTaxEvaluation>? afterTax = ProposalTerms.Tax(version.Assumptions, policy) is { } tax
            ? AfterTaxEvaluator.Evaluate(ProposalTerms.Model(version.Assumptions, policy, proposal.RiskClass), tax)
            : null;
        DepreciationSchedule? depreciation = afterTax?.Value is { } r ? r.Settings.Depreciation.DisposedIn(r.Table.Rows.Count - 1, r.Settings.DisposalYearShare) : null;
        var earlier = proposal.Versions.Where(v => v.Number <= version.Number).ToList();
        var marr = policy.RateFor(proposal.RiskClass);
        IReadOnlyList<VersionDifference> changes = [.. Enumerable.Range(1, Math.Max(0, earlier.Count - 1)).Select(k => VersionComparison.Compare(earlier[k - 1], earlier[k], marr))];
        Outcome<RiskStudy>? risk = ProposalRisk.Prepare(version.Assumptions, policy, proposal.RiskClass, afterTax: true);
        SensitivityResult? sensitivity = risk?.Value is { } prepared ? ProposalRisk.Analyse(prepared) : null;
        SimulationSummary? simulation = simulate && risk?.Value is { } ready ? ProposalRisk.Simulate(ready, cancellationToken: cancellationToken) : null;
        return new VersionFigures(evaluation, evaluation is null ? [] : EvaluationProfile.Of(evaluation), evaluation is null ? [] : PeriodTable.Of(evaluation), evaluation is null ? [] : PeriodTable.ElementWorths(evaluation),
            study, afterTax, depreciation, changes, risk, sensitivity, simulation)
        {
            WhyNoMeasures = evaluated.Errors is [var first, ..] ? Display.FieldWording.Message(first, version.Assumptions) : null,
            Outlays = afterTax?.Value is { } a ? OutlayAssets.Of(a.BeforeTax.Model, a.Settings.Outlays) : null,
        };
    }
}
