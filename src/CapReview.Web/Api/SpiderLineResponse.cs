namespace CapReview.Web.Api;

/// <summary>One line of the spider: the figure at each change of the parameter's most likely value (fractions, −0.5 … 0.5).</summary>
public sealed record SpiderLineResponse(string Parameter, IReadOnlyList<double> Changes, IReadOnlyList<double?> Values);
