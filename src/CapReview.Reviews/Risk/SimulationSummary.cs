using CapReview.Engine.Risk;

namespace CapReview.Reviews.Risk;

/// <summary>
/// A seeded Monte Carlo run of a proposal, summarised on its present worth: the same settings and seed always give
/// the same summary.
/// </summary>
/// <param name="Trials">Trials run.</param>
/// <param name="Seed">The seed every draw followed.</param>
/// <param name="Mean">Mean present worth of the valid trials.</param>
/// <param name="StandardDeviation">Sample standard deviation of present worth.</param>
/// <param name="ProbabilityOfLoss">The share of valid trials with present worth below zero.</param>
/// <param name="Percentiles">Present worth at the usual percentiles.</param>
/// <param name="Histogram">Present worth in 40 bins.</param>
/// <param name="Invalid">Trials whose draws made no valid model (left out of every figure).</param>
/// <param name="Detail">The engine's full result: annual worth, rate of return and the cumulative distribution too.</param>
public sealed record SimulationSummary(
    int Trials,
    int Seed,
    double Mean,
    double StandardDeviation,
    double ProbabilityOfLoss,
    PresentWorthPercentiles Percentiles,
    IReadOnlyList<HistogramBin> Histogram,
    int Invalid,
    MonteCarloResult Detail)
{
    internal static SimulationSummary Of(MonteCarloResult result)
    {
        // The engine's cumulative curve holds present worth at each whole percent (0 … 100) of the valid trials.
        IReadOnlyList<double> at = result.Cumulative;
        PresentWorthPercentiles percentiles = at.Count == 101
            ? new(at[5], at[10], at[25], at[50], at[75], at[90], at[95])
            : new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        return new SimulationSummary(result.Trials, result.Seed, result.PresentWorth.Mean, result.PresentWorth.StandardDeviation,
            result.ProbabilityOfLoss, percentiles, result.Histogram, result.Invalid, result);
    }
}
