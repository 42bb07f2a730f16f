namespace CapReview.Reviews.Portfolio;

/// <summary>A what-if on the portfolio: another MARR, another capital limit now, or the other objective.</summary>
public sealed record PortfolioQuery(double MarrShift = 0.0, decimal? CapitalLimit = null, SelectionObjective? Objective = null, bool AfterTax = false);
