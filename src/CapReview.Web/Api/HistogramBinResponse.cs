namespace CapReview.Web.Api;

/// <summary>One bar of the histogram: its range of present worth and how many trials fell in it.</summary>
public sealed record HistogramBinResponse(double From, double To, int Count);
