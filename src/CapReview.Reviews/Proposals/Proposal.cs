namespace CapReview.Reviews.Proposals;

/// <summary>One investment idea, owned by a project lead, with its versions of assumptions and its workflow status.</summary>
public sealed class Proposal
{
    public int Id { get; set; }

    /// <summary>The reference people quote, e.g. P-0007.</summary>
    public string Reference { get; set; } = "";

    public required string OwnerId { get; set; }

    public required string Title { get; set; }

    public string Description { get; set; } = "";

    public ProposalCategory Category { get; set; }

    public RiskClass RiskClass { get; set; } = RiskClass.Standard;

    public ProposalStatus Status { get; set; } = ProposalStatus.Draft;

    public int? BudgetCycleId { get; set; }

    /// <summary>Optimistic concurrency: raised on every change; a stale value makes the save fail.</summary>
    public int Revision { get; set; }

    public List<ProposalVersion> Versions { get; } = [];
}
