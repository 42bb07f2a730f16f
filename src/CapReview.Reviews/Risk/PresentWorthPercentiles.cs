namespace CapReview.Reviews.Risk;

/// <summary>Present worth at the 5th, 10th, 25th, 50th, 75th, 90th and 95th percentiles of the valid trials.</summary>
public sealed record PresentWorthPercentiles(double P5, double P10, double P25, double P50, double P75, double P90, double P95);
