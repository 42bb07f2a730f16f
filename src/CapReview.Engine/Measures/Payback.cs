namespace CapReview.Engine.Measures;

/// <summary>
/// Payback: the time at which the cumulative flows, undiscounted (simple) or discounted at the MARR, first recover
/// the investment, interpolated within the period on the assumption that the period's flow arrives evenly.
/// ASTM E1121, "Standard Practice for Measuring Payback for Investments in Buildings and Building Systems".
/// </summary>
public static class Payback
{
    /// <summary>Periods until the undiscounted cumulative flow is recovered; null when never.</summary>
    public static double? Simple(IReadOnlyList<double> netFlows) => Recovery(netFlows, 0.0);

    /// <summary>Periods until the cumulative flow discounted at <paramref name="ratePerPeriod"/> is recovered; null when never.</summary>
    public static double? Discounted(IReadOnlyList<double> netFlows, double ratePerPeriod) => Recovery(netFlows, ratePerPeriod);

    private static double? Recovery(IReadOnlyList<double> netFlows, double ratePerPeriod)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        double v = 1.0 / (1.0 + ratePerPeriod);
        double discount = 1.0;
        double cumulative = 0.0;
        bool invested = false;
        for (int t = 0; t < netFlows.Count; t++)
        {
            double flow = netFlows[t] * discount;
            double before = cumulative;
            cumulative += flow;
            discount *= v;
            if (cumulative < 0.0)
            {
                invested = true;
            }
            else if (invested && flow > 0.0)
            {
                // Recovered within period t: the fraction of its flow needed to lift the balance to zero.
                return t - 1 + (-before / flow);
            }
        }
        return invested ? null : 0.0;
    }
}
