namespace CapReview.Web.Api;

/// <summary>The parameter's value at which present worth is zero, the others at most likely; null when none is near its range.</summary>
public sealed record BreakEvenResponse(string Parameter, string Target, double? Value);
