namespace CapReview.Web.Api;

/// <summary>One scenario's present and annual worth.</summary>
public sealed record ScenarioResponse(string Name, double? PresentWorth, double? AnnualWorth);
