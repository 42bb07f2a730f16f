namespace CapReview.Engine.Measures;

/// <summary>
/// Payback: the time at which the cumulative flows, undiscounted (simple) or discounted at the MARR, first recover
/// the investment, interpolated within the period on the assumption that the period's flow arrives evenly.
/// ASTM E1121, "Standard Practice for Measuring Payback for Investments in Buildings and Building Systems".
/// </summary>
public static class Payback
{
    // The unit roundoff with a little room, as in FlowSigns.
    private const double Epsilon = 2.3e-16;

    /// <summary>Periods until the undiscounted cumulative flow is recovered; null when never, and when there is no flow at all (nothing to recover, nothing recovered).</summary>
    public static double? Simple(IReadOnlyList<double> netFlows) => Recovery(netFlows, 0.0);

    /// <summary>Periods until the cumulative flow discounted at <paramref name="ratePerPeriod"/> is recovered; null when never, and when there is no flow at all.</summary>
    public static double? Discounted(IReadOnlyList<double> netFlows, double ratePerPeriod) => Recovery(netFlows, ratePerPeriod);

    /// <summary>
    /// The cumulative worth C_t = Σ_{s≤t} F_s (1 + i)^−s is followed as C_t itself where i ≥ 0 (its discount factors only
    /// shrink) and as C_t (1 + i)^t where i &lt; 0 (the same sign, and the factors that would grow past every double never
    /// form); the fraction of period t needed, −C_(t−1) / (F_t (1 + i)^−t), is the same ratio in either form.
    /// </summary>
    /// <remarks>
    /// A cumulative worth within its own rounding error of zero, (t + 1) ε Σ|F_s (1 + i)^−s| over its t + 1 terms (the
    /// rule the sign evidence of the rate of return uses), is zero: flows that recover the investment exactly at the
    /// end of period t pay back at t, not a rounding error before it, after it, or never when t is the last period.
    /// </remarks>
    private static double? Recovery(IReadOnlyList<double> netFlows, double ratePerPeriod)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        bool atPeriod = ratePerPeriod < 0.0;
        double v = 1.0 / (1.0 + ratePerPeriod);
        double growth = 1.0 + ratePerPeriod;
        double discount = 1.0;
        double cumulative = 0.0, gross = 0.0;
        bool invested = false;
        for (int t = 0; t < netFlows.Count; t++)
        {
            double flow = atPeriod ? netFlows[t] : netFlows[t] * discount;
            double before = atPeriod ? cumulative * growth : cumulative;
            cumulative = before + flow;
            gross = (atPeriod ? gross * growth : gross) + Math.Abs(flow);
            double negligible = (t + 1) * Epsilon * gross;
            discount *= v;
            if (cumulative < -negligible)
            {
                invested = true;
            }
            else if (invested && flow > 0.0)
            {
                // Recovered within period t: the fraction of its flow needed to lift the balance to zero; all of it
                // when the balance is zero at the period's end.
                return cumulative <= negligible ? t : t - 1 + (-before / flow);
            }
        }
        // Flows that never dip below zero pay back at once; a model with no flow at all has no payback to speak of.
        return invested || netFlows.All(f => f == 0.0) ? null : 0.0;
    }
}
