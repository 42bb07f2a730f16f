namespace CapReview.Web.Api;

/// <summary>How the optimal set and the greedy fill differ: the worth gained, and the proposals only one of them funds.</summary>
public sealed record PortfolioDifferenceResponse(double Worth, double FirstCost, IReadOnlyList<string> OnlyOptimal, IReadOnlyList<string> OnlyGreedy);
