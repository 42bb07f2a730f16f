namespace CapReview.Reviews.Decisions;

/// <summary>One proposal the selected portfolio would approve, as the member confirms it.</summary>
public sealed record PortfolioApproval(int ProposalId, string Reference, string Title, int Version, double FirstCost);
