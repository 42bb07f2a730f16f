namespace CapReview.Reviews.Decisions;

/// <summary>
/// A recorded decision with the reference of its proposal, detached from storage: the override it carries, if any, and
/// the later decision on the same proposal that superseded it, if any.
/// </summary>
public sealed record DecisionView(int Id, int ProposalId, string Reference, int CycleId, int VersionNumber, string AssumptionsHash, int MarrPolicyVersionId,
    DecisionOutcome Outcome, string Conditions, string DecidedBy, DateTimeOffset DecidedAt, string OverriddenRules = "", string OverrideReason = "", int? SupersededBy = null)
{
    /// <summary>Copied from another installation's document: no act of a member here.</summary>
    public bool Imported => Interchange.CycleImporter.IsImported(DecidedBy);

    public static DecisionView Of(Decision d, string reference, int? supersededBy = null)
    {
        ArgumentNullException.ThrowIfNull(d);
        return new(d.Id, d.ProposalId, reference, d.BudgetCycleId, d.VersionNumber, d.AssumptionsHash, d.MarrPolicyVersionId, d.Outcome, d.Conditions, d.DecidedBy, d.DecidedAt,
            d.OverriddenRules, d.OverrideReason, supersededBy);
    }
}
