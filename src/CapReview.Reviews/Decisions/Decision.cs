namespace CapReview.Reviews.Decisions;

/// <summary>
/// The board's decision on one version of a proposal, with its conditions, the hash of the assumptions it rests on and
/// the MARR policy version it was judged at. Written once (nothing here changes it after construction); a later
/// decision on a later version is a new row, and so is a changed decision before the cycle is signed off: the latest
/// decision of a proposal is the one that stands, the earlier ones stay as they were. The service makes one through
/// <see cref="Proposals.Proposal.Decide"/>. A decision that breaks the board's portfolio rules carries the rules it
/// overrode and the member's reason (<see cref="RecordOverride"/>).
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

    /// <summary>The board's rules this decision was recorded against, in words; empty when it broke none.</summary>
    public string OverriddenRules { get; private set; } = "";

    /// <summary>Why the member recorded it all the same; empty when it broke no rule.</summary>
    public string OverrideReason { get; private set; } = "";

    public bool Overrides => OverriddenRules.Length > 0;

    /// <summary>Records, before the decision is stored, which rules it breaks and why it is recorded all the same.</summary>
    public void RecordOverride(string rules, string reason)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(rules);
        ArgumentException.ThrowIfNullOrWhiteSpace(reason);
        if (Id != 0 || Overrides)
        {
            throw new InvalidOperationException("A stored decision is never changed.");
        }
        OverriddenRules = rules.Length > 4000 ? rules[..4000] : rules;
        OverrideReason = reason.Trim();
    }
}
