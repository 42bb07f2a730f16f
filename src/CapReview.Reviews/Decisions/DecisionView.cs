namespace CapReview.Reviews.Decisions;

/// <summary>A recorded decision with the reference of its proposal, detached from storage.</summary>
public sealed record DecisionView(int Id, int ProposalId, string Reference, int CycleId, int VersionNumber, string AssumptionsHash, int MarrPolicyVersionId,
    DecisionOutcome Outcome, string Conditions, string DecidedBy, DateTimeOffset DecidedAt)
{
    /// <summary>Copied from another installation's document: no act of a member here.</summary>
    public bool Imported => Interchange.CycleImporter.IsImported(DecidedBy);

    public static DecisionView Of(Decision d, string reference)
    {
        ArgumentNullException.ThrowIfNull(d);
        return new(d.Id, d.ProposalId, reference, d.BudgetCycleId, d.VersionNumber, d.AssumptionsHash, d.MarrPolicyVersionId, d.Outcome, d.Conditions, d.DecidedBy, d.DecidedAt);
    }
}
