namespace CapReview.Web.Api;

/// <summary>
/// A parameter whose most likely value is not its input's value in the model sent: the figures centre on the most
/// likely value, so the caller is told by how much it differs (stored units: rates as fractions).
/// </summary>
public sealed record ParameterDriftResponse(string Parameter, string Target, double MostLikely, double Current, double Difference);
