using CapReview.Reviews.Risk;

namespace CapReview.Web.Api;

/// <summary>The simulation's summary of present worth over the valid trials.</summary>
/// <param name="Trials">Trials run.</param>
/// <param name="Seed">The seed every draw followed.</param>
/// <param name="Mean">Mean present worth.</param>
/// <param name="StandardDeviation">Sample standard deviation of present worth.</param>
/// <param name="ProbabilityOfLoss">The share of valid trials with present worth below zero.</param>
/// <param name="Percentiles">Present worth at the 5th, 10th, 25th, 50th, 75th, 90th and 95th percentiles, keyed p5 … p95.</param>
/// <param name="Histogram">Present worth in 40 bins.</param>
/// <param name="Invalid">Trials whose draws made no valid model, left out.</param>
public sealed record SimulationResponse(
    int Trials,
    int Seed,
    double Mean,
    double StandardDeviation,
    double ProbabilityOfLoss,
    PresentWorthPercentiles Percentiles,
    IReadOnlyList<HistogramBinResponse> Histogram,
    int Invalid)
{
    public static SimulationResponse From(SimulationSummary s)
    {
        ArgumentNullException.ThrowIfNull(s);
        return new SimulationResponse(s.Trials, s.Seed, s.Mean, s.StandardDeviation, s.ProbabilityOfLoss, s.Percentiles,
            [.. s.Histogram.Select(b => new HistogramBinResponse(b.From, b.To, b.Count))], s.Invalid);
    }
}
