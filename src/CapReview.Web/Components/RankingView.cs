namespace CapReview.Web.Components;

/// <summary>The ranking page's filters, sort and what-if as remembered.</summary>
public sealed record RankingView(string Category, string Risk, string SortKey, bool Descending, double Shift, bool AfterTax, bool ShowRisk);
