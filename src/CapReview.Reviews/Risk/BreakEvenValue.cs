using CapReview.Engine.Risk;

namespace CapReview.Reviews.Risk;

/// <summary>The value of one parameter at which present worth is zero, the others at most likely; null when none is near its range.</summary>
public sealed record BreakEvenValue(UncertainParameter Parameter, double? Value);
