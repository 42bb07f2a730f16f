namespace CapReview.Engine.Rates;

/// <summary>
/// The combined (market) rate from a real rate and an inflation rate, and back, all effective over the same period:
/// 1 + market = (1 + real)(1 + inflation). Fisher, "The Theory of Interest" (1930), chapter 2.
/// </summary>
public static class InflationAdjustment
{
    /// <summary>market = real + inflation + real × inflation.</summary>
    public static double MarketRate(double realRate, double inflationRate)
    {
        CheckAboveMinusOne(realRate, nameof(realRate));
        CheckAboveMinusOne(inflationRate, nameof(inflationRate));
        return realRate + inflationRate + realRate * inflationRate;
    }

    /// <summary>real = (market − inflation) / (1 + inflation).</summary>
    public static double RealRate(double marketRate, double inflationRate)
    {
        CheckAboveMinusOne(marketRate, nameof(marketRate));
        CheckAboveMinusOne(inflationRate, nameof(inflationRate));
        return (marketRate - inflationRate) / (1.0 + inflationRate);
    }

    private static void CheckAboveMinusOne(double rate, string name)
    {
        if (!double.IsFinite(rate) || rate <= -1.0)
        {
            throw new ArgumentOutOfRangeException(name, rate, "The rate must be finite and greater than -100%.");
        }
    }
}
