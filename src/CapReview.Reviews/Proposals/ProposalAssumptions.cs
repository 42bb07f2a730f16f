using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Everything a version of a proposal assumes: the cash-flow model (its horizon is the life), an optional study period,
/// and the MARR: the cycle's policy unless a documented override is given. Tax, inflation and uncertainty settings join
/// here in later issues.
/// </summary>
public sealed record ProposalAssumptions
{
    public required ModelSpec Model { get; init; }

    /// <summary>A study period shorter or longer than the life, in periods; null for the life itself.</summary>
    public int? StudyPeriod { get; init; }

    /// <summary>A MARR that replaces the policy's for this proposal, with the reason; null to use the policy.</summary>
    public MarrOverride? MarrOverride { get; init; }
}

/// <summary>A proposal's own MARR in place of the policy's, and why.</summary>
public sealed record MarrOverride(RateSpec Rate, string Reason);
