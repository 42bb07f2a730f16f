using CapReview.Engine.Rates;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Api;

/// <summary>A new budget cycle as an administrator sends it.</summary>
public sealed record NewCycleRequest(string? Name, decimal? CapitalLimit, int? MarrPolicyVersionId, DateOnly? OpensOn, DateOnly? ClosesOn, int? RequiredSignOffs);

/// <summary>A cycle moved on: <c>inReview</c> (no more new submissions) or <c>closed</c> (after it is decided).</summary>
public sealed record CycleStatusRequest(CycleStatus? Status, int? Revision);

/// <summary>A new MARR policy version; rates as fractions (0.08 is 8 %).</summary>
public sealed record NewMarrPolicyRequest(double? Rate, RateBasis? Basis, int? CompoundingsPerYear, DateOnly? EffectiveFrom, string? Reason,
    double? LowRiskPremium, double? StandardRiskPremium, double? HighRiskPremium, double? InflationRate, bool? RealMarr, double? AfterTaxRate);

/// <summary>A MARR policy version as stored; rates as fractions. A retired version (entered by mistake) says so, and why.</summary>
public sealed record MarrPolicyResponse(int Id, int Number, double Rate, RateBasis Basis, int CompoundingsPerYear, double EffectiveAnnualRate, DateOnly EffectiveFrom,
    double LowRiskPremium, double StandardRiskPremium, double HighRiskPremium, double InflationRate, bool RealMarr, double? AfterTaxRate, string Reason, DateTimeOffset CreatedAt,
    bool Retired = false, string? RetiredBecause = null)
{
    public static MarrPolicyResponse From(MarrPolicyVersion m, MarrVersionRetirement? retirement = null)
    {
        ArgumentNullException.ThrowIfNull(m);
        return new(m.Id, m.Number, m.Rate, m.Basis, m.CompoundingsPerYear, m.BaseRate().EffectiveAnnual(), m.EffectiveFrom, m.LowRiskPremium, m.StandardRiskPremium,
            m.HighRiskPremium, m.InflationRate, m.RealMarr, m.AfterTaxRate, m.Reason, m.CreatedAt, retirement is not null, retirement?.Reason);
    }
}

/// <summary>The cycle's plan: the ranking's study period, later budget years' limits, the selection objective.</summary>
public sealed record CyclePlanRequest(int? StudyPeriodYears, IReadOnlyList<decimal>? LaterYearLimits, SelectionObjective? Objective, int? Revision);

/// <summary>An exclusive group (at most one member funded; exactly one when mandatory), added or replaced by name.</summary>
public sealed record GroupRequest(string? Name, bool? Mandatory, IReadOnlyList<int>? ProposalIds);

/// <summary>A contingency: the dependent proposal is funded only with its prerequisite.</summary>
public sealed record ContingencyRequest(int? DependentProposalId, int? PrerequisiteProposalId);

/// <summary>A cycle's portfolio rules: its plan, exclusive groups and contingencies.</summary>
public sealed record PortfolioRulesResponse(int CycleId, int? StudyPeriodYears, IReadOnlyList<decimal> LaterYearLimits, SelectionObjective Objective, int Revision,
    IReadOnlyList<GroupResponse> Groups, IReadOnlyList<ContingencyResponse> Contingencies)
{
    public static PortfolioRulesResponse From(BudgetCycle cycle, PortfolioRules rules)
    {
        ArgumentNullException.ThrowIfNull(cycle);
        ArgumentNullException.ThrowIfNull(rules);
        return new(cycle.Id, cycle.StudyPeriodYears, [.. cycle.LaterYearLimits], cycle.Objective, cycle.Revision,
            [.. rules.Groups.Select(g => new GroupResponse(g.Id, g.Name, g.Mandatory, [.. g.ProposalIds]))],
            [.. rules.Contingencies.Select(c => new ContingencyResponse(c.Id, c.DependentProposalId, c.PrerequisiteProposalId))]);
    }
}

/// <summary>An exclusive group as stored.</summary>
public sealed record GroupResponse(int Id, string Name, bool Mandatory, IReadOnlyList<int> ProposalIds);

/// <summary>A contingency as stored.</summary>
public sealed record ContingencyResponse(int Id, int DependentProposalId, int PrerequisiteProposalId);
