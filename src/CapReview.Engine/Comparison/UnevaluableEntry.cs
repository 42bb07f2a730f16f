namespace CapReview.Engine.Comparison;

/// <summary>A proposal the ranking could not evaluate on its basis, and why, in words.</summary>
public sealed record UnevaluableEntry(string Id, string Reason);
