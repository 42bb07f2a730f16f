namespace CapReview.Engine.Measures;

/// <summary>
/// The external (modified) rate of return: disbursements are brought to time 0 at a finance rate, receipts are carried
/// to period n at a reinvestment rate, and the rate that equates the two is
/// (FW of receipts / −PW of disbursements)^(1/n) − 1. ASTM E1057, "Standard Practice for Measuring Internal Rate of
/// Return and Adjusted Internal Rate of Return for Investments in Buildings and Building Systems".
/// </summary>
public static class ExternalRateOfReturn
{
    /// <summary>The rate per period, or null when there are no receipts, no disbursements or no periods.</summary>
    public static double? Compute(IReadOnlyList<double> netFlows, double financeRate, double reinvestmentRate)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        int n = netFlows.Count - 1;
        if (n < 1)
        {
            return null;
        }
        double presentCost = 0.0;
        double futureReceipts = 0.0;
        double financeDiscount = 1.0 / (1.0 + financeRate);
        double reinvestGrowth = 1.0 + reinvestmentRate;
        double discount = 1.0;
        for (int t = 0; t <= n; t++)
        {
            double f = netFlows[t];
            if (f < 0.0)
            {
                presentCost -= f * discount;
            }
            discount *= financeDiscount;
        }
        for (int t = 0; t <= n; t++)
        {
            futureReceipts = futureReceipts * reinvestGrowth + Math.Max(netFlows[t], 0.0);
        }
        if (presentCost <= 0.0 || futureReceipts <= 0.0)
        {
            return null;
        }
        return Math.Exp(Math.Log(futureReceipts / presentCost) / n) - 1.0;
    }
}
