namespace CapReview.Engine.Validation;

/// <summary>One thing wrong with the input: the field it concerns, as a path such as <c>elements[2].last</c>, and why.</summary>
public sealed record InputError(string Field, string Message);
