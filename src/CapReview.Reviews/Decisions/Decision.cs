namespace CapReview.Reviews.Decisions;

/// <summary>
/// The board's decision on one version of a proposal, with its conditions, the hash of the assumptions it rests on and
/// the MARR policy version it was judged at. Written once; a later decision on a later version is a new row.
/// </summary>
public sealed class Decision
{
    public int Id { get; set; }

    public int ProposalId { get; set; }

    public int BudgetCycleId { get; set; }

    public int VersionNumber { get; set; }

    public required string AssumptionsHash { get; set; }

    public int MarrPolicyVersionId { get; set; }

    public DecisionOutcome Outcome { get; set; }

    public string Conditions { get; set; } = "";

    public required string DecidedBy { get; set; }

    public DateTimeOffset DecidedAt { get; set; }
}
