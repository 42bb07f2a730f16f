namespace CapReview.Web.Api;

/// <summary>A point of the efficient frontier: the best total worth at a capital limit and the set that reaches it.</summary>
public sealed record FrontierPointResponse(double CapitalLimit, double TotalWorth, double TotalCost, IReadOnlyList<string> Chosen, bool ProvenOptimal);
