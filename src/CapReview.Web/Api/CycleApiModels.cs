using CapReview.Engine.Evaluation;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Api;

/// <summary>A budget cycle as the API shows it.</summary>
public sealed record CycleResponse(int Id, string Name, string Status, decimal CapitalLimit, IReadOnlyList<decimal> LaterYearLimits, int? StudyPeriodYears,
    int MarrPolicyVersionId, DateOnly OpensOn, DateOnly ClosesOn, int RequiredSignOffs, int Revision)
{
    public static CycleResponse From(BudgetCycle c)
    {
        ArgumentNullException.ThrowIfNull(c);
        return new(c.Id, c.Name, c.Status.ToString(), c.CapitalLimit, [.. c.LaterYearLimits], c.StudyPeriodYears, c.MarrPolicyVersionId, c.OpensOn, c.ClosesOn, c.RequiredSignOffs, c.Revision);
    }
}

/// <summary>
/// One ranked proposal: every measure on the cycle's basis; rates annual effective as fractions. A null measure has
/// its reason in <c>unavailable</c>, keyed by the row's field name.
/// </summary>
public sealed record RankingRowResponse(int Rank, int ProposalId, string Reference, string Title, int Version, string AssumptionsHash, double Marr,
    double AnnualWorth, double PresentWorth, IReadOnlyList<double> RatesOfReturn, string RateOfReturnKind, double? ExternalRate, double? DiscountedPaybackYears,
    double? BenefitCostRatio, double FirstCost, double LifeYears, string Basis, string? ExclusiveGroup, IReadOnlyList<string> Needs,
    IReadOnlyDictionary<string, string> Unavailable)
{
    /// <summary>The row's fields whose reasons the evaluation gives under the measures' own names.</summary>
    private static readonly (string Row, string Measure)[] Reasons =
    [
        ("externalRate", UnavailableMeasures.ExternalRate),
        ("discountedPaybackYears", UnavailableMeasures.DiscountedPayback),
        ("benefitCostRatio", UnavailableMeasures.ConventionalRatio),
    ];

    internal static IReadOnlyDictionary<string, string> ReasonsOf(Engine.Evaluation.Evaluation evaluation) =>
        Reasons.Where(r => evaluation.Unavailable.ContainsKey(r.Measure)).ToDictionary(r => r.Row, r => evaluation.Unavailable[r.Measure], StringComparer.Ordinal);
}

/// <summary>A cycle's ranking and the proposals left out of it.</summary>
public sealed record RankingResponse(int CycleId, string Basis, bool AfterTax, double MarrShift, IReadOnlyList<RankingRowResponse> Rows, IReadOnlyList<UnrankedResponse> Unranked)
{
    public static RankingResponse From(CycleRanking r)
    {
        ArgumentNullException.ThrowIfNull(r);
        return new(r.Cycle.Id, r.Basis, r.AfterTax, r.MarrShift,
            [.. r.Rows.Select(x => new RankingRowResponse(x.Ranked.Rank, x.Proposal.Id, x.Proposal.Reference, x.Proposal.Title, x.Version.Number, x.Version.AssumptionsHash,
                x.Marr.EffectiveAnnual(), x.Ranked.AnnualWorth, x.Ranked.PresentWorth, x.Ranked.Evaluation.RatesOfReturn,
                x.Ranked.Evaluation.RatesOfReturn.Count switch { 0 => "none", 1 => "unique", _ => "several" }, x.Ranked.Evaluation.ExternalRate,
                x.Ranked.Evaluation.DiscountedPaybackYears, x.Ranked.Evaluation.BenefitCost.Conventional, x.Ranked.FirstCost, x.Ranked.LifeYears, x.Ranked.Basis,
                x.Group?.Name, x.Prerequisites, RankingRowResponse.ReasonsOf(x.Ranked.Evaluation)))],
            [.. r.Unranked.Select(u => new UnrankedResponse(u.Proposal.Id, u.Proposal.Reference, u.Reason))]);
    }
}

/// <summary>A proposal of the cycle that could not be ranked, and why.</summary>
public sealed record UnrankedResponse(int ProposalId, string Reference, string Reason);
