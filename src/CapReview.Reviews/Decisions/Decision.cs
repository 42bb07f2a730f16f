namespace CapReview.Reviews.Decisions;

/// <summary>
/// The board's decision on one version of a proposal, with its conditions, the hash of the assumptions it rests on and
/// the MARR policy version it was judged at. Written once (nothing here changes it after construction); a later
/// decision on a later version is a new row. The service makes one through <see cref="Proposals.Proposal.Decide"/>.
/// </summary>
public sealed class Decision
{
    private Decision()
    {
    }

    public Decision(int proposalId, int budgetCycleId, int versionNumber, string assumptionsHash, int marrPolicyVersionId,
        DecisionOutcome outcome, string conditions, string decidedBy, DateTimeOffset decidedAt)
    {
        ProposalId = proposalId;
        BudgetCycleId = budgetCycleId;
        VersionNumber = versionNumber;
        AssumptionsHash = assumptionsHash;
        MarrPolicyVersionId = marrPolicyVersionId;
        Outcome = outcome;
        Conditions = conditions;
        DecidedBy = decidedBy;
        DecidedAt = decidedAt;
    }

    public int Id { get; private set; }

    public int ProposalId { get; private set; }

    public int BudgetCycleId { get; private set; }

    public int VersionNumber { get; private set; }

    public string AssumptionsHash { get; private set; } = "";

    public int MarrPolicyVersionId { get; private set; }

    public DecisionOutcome Outcome { get; private set; }

    public string Conditions { get; private set; } = "";

    public string DecidedBy { get; private set; } = "";

    public DateTimeOffset DecidedAt { get; private set; }
}
