namespace CapReview.Web.Components;

/// <summary>The portfolio page's what-if as remembered.</summary>
public sealed record PortfolioView(string Limit, double Shift, string Objective, bool AfterTax);
