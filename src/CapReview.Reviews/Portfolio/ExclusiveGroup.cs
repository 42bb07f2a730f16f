namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Proposals of a cycle that exclude each other (ways of meeting the same need): at most one is funded, exactly one
/// when the group is mandatory (the need must be met).
/// </summary>
public sealed class ExclusiveGroup
{
    public int Id { get; set; }

    public int BudgetCycleId { get; set; }

    public required string Name { get; set; }

    public bool Mandatory { get; set; }

    public List<int> ProposalIds { get; set; } = [];
}
