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
    double? Mean,
    double? StandardDeviation,
    double? ProbabilityOfLoss,
    PercentilesResponse Percentiles,
    IReadOnlyList<HistogramBinResponse> Histogram,
    int Invalid)
{
    public static SimulationResponse From(SimulationSummary s)
    {
        ArgumentNullException.ThrowIfNull(s);
        PresentWorthPercentiles p = s.Percentiles;
        var percentiles = new PercentilesResponse(F(p.P5), F(p.P10), F(p.P25), F(p.P50), F(p.P75), F(p.P90), F(p.P95));
        return new SimulationResponse(s.Trials, s.Seed, F(s.Mean), F(s.StandardDeviation), F(s.ProbabilityOfLoss), percentiles,
            [.. s.Histogram.Select(b => new HistogramBinResponse(b.From, b.To, b.Count))], s.Invalid);
    }

    private static double? F(double value) => RiskAnalysisResponse.Finite(value);
}

/// <summary>Present worth at the 5th … 95th percentiles; null when no trial made a valid model.</summary>
public sealed record PercentilesResponse(double? P5, double? P10, double? P25, double? P50, double? P75, double? P90, double? P95);
