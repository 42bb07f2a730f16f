namespace CapReview.Reviews.Portfolio;

/// <summary>A proposal of a cycle that can be funded only if another is: the dependent needs its prerequisite.</summary>
public sealed class Contingency
{
    public int Id { get; set; }

    public int BudgetCycleId { get; set; }

    public int DependentProposalId { get; set; }

    public int PrerequisiteProposalId { get; set; }
}
