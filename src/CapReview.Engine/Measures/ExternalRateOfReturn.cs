namespace CapReview.Engine.Measures;

/// <summary>
/// The external (modified) rate of return: disbursements are brought to time 0 at a finance rate, receipts are carried
/// to period n at a reinvestment rate, and the rate that equates the two is
/// (FW of receipts / −PW of disbursements)^(1/n) − 1. ASTM E1057, "Standard Practice for Measuring Internal Rate of
/// Return and Adjusted Internal Rate of Return for Investments in Buildings and Building Systems".
/// </summary>
public static class ExternalRateOfReturn
{
    /// <summary>
    /// The rate per period, or null when there are no receipts, no disbursements or no periods. Both sums are formed as
    /// logarithms (the largest term's, plus the log of the terms relative to it), so that neither overflows nor
    /// vanishes at the ends of the rate range (receipts carried at 1000% over 1,200 periods pass every double, a
    /// payment brought from period 400 at −90% would too); the result is a number, or positive infinity when the rate
    /// itself is past every double.
    /// </summary>
    public static double? Compute(IReadOnlyList<double> netFlows, double financeRate, double reinvestmentRate)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        int n = netFlows.Count - 1;
        if (n < 1)
        {
            return null;
        }
        double finance = Numerics.StableMath.Log1p(financeRate), reinvestment = Numerics.StableMath.Log1p(reinvestmentRate);
        double logCost = LogSum(netFlows, payments: true, t => -t * finance);
        double logReceipts = LogSum(netFlows, payments: false, t => (n - t) * reinvestment);
        if (double.IsNegativeInfinity(logCost) || double.IsNegativeInfinity(logReceipts))
        {
            return null;
        }
        return Numerics.StableMath.Expm1((logReceipts - logCost) / n);
    }

    /// <summary>ln Σ a_t e^(g(t)) over the payments (a_t = −F_t, F_t &lt; 0) or the receipts (a_t = F_t &gt; 0); −∞ when there are none.</summary>
    private static double LogSum(IReadOnlyList<double> flows, bool payments, Func<int, double> exponent)
    {
        double largest = double.NegativeInfinity;
        for (int t = 0; t < flows.Count; t++)
        {
            if (Part(flows[t], payments) > 0.0)
            {
                largest = Math.Max(largest, Math.Log(Part(flows[t], payments)) + exponent(t));
            }
        }
        if (double.IsNegativeInfinity(largest))
        {
            return largest;
        }
        double sum = 0.0;
        for (int t = 0; t < flows.Count; t++)
        {
            if (Part(flows[t], payments) > 0.0)
            {
                sum += Math.Exp(Math.Log(Part(flows[t], payments)) + exponent(t) - largest);
            }
        }
        return largest + Math.Log(sum);
    }

    private static double Part(double flow, bool payments) => payments ? Math.Max(-flow, 0.0) : Math.Max(flow, 0.0);
}
