using CapReview.Engine.Comparison;

namespace CapReview.Reviews.Portfolio;

/// <summary>A point of the efficient frontier: the best total worth at a capital limit.</summary>
public sealed record FrontierPoint(double Limit, Selection Selection);
