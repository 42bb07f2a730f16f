namespace CapReview.Web.Api;

/// <summary>One bar of the tornado: the figure with the parameter at its low and at its high value, the others at most likely.</summary>
public sealed record TornadoBarResponse(string Parameter, string Target, double? AtLow, double? AtHigh, double? Swing);
