using CapReview.Engine.Factors;

namespace CapReview.Engine.Comparison;

/// <summary>The equivalent annual cost of keeping an asset k years, for k = 1 … N.</summary>
/// <param name="Years">Retirement after 1, 2, … years.</param>
/// <param name="AnnualCosts">EAC of retiring after that many years (positive = cost).</param>
/// <param name="MarginalCosts">The cost of keeping the asset through year k: lost return on its value, its fall in value, its operating cost.</param>
/// <param name="BestYears">The economic service life: the retirement year of least EAC.</param>
public sealed record ServiceLife(IReadOnlyList<int> Years, IReadOnlyList<double> AnnualCosts, IReadOnlyList<double> MarginalCosts, int BestYears)
{
    public double LeastAnnualCost => AnnualCosts[BestYears - 1];
}

/// <summary>
/// Economic service life and replacement timing, yearly periods, effective rate i. For an asset worth P now (its first
/// cost, or a defender's market value today), market values MV_k and operating costs OC_k in years k = 1 … N:
/// EAC(k) = P (A/P, i, k) − MV_k (A/F, i, k) + [Σ_{j≤k} OC_j (P/F, i, j)] (A/P, i, k); the marginal cost of year k is
/// MV_(k−1)(1 + i) − MV_k + OC_k. The defender is kept while its next year's marginal cost stays below the
/// challenger's least EAC. Common practice, no source; see docs/methods.md.
/// </summary>
public static class EconomicServiceLife
{
    public static ServiceLife Of(double valueNow, IReadOnlyList<double> marketValues, IReadOnlyList<double> operatingCosts, double i)
    {
        ArgumentNullException.ThrowIfNull(marketValues);
        ArgumentNullException.ThrowIfNull(operatingCosts);
        int years = marketValues.Count;
        if (years < 1 || years != operatingCosts.Count || years > CompoundInterest.MaxPeriods)
        {
            throw new ArgumentException("Give one market value and one operating cost for each year, 1 to 1,200 years.", nameof(marketValues));
        }
        var costs = new double[years];
        var marginal = new double[years];
        double presentOperating = 0.0;
        double previousValue = valueNow;
        for (int k = 1; k <= years; k++)
        {
            presentOperating += operatingCosts[k - 1] * CompoundInterest.SinglePaymentPresentWorth(i, k);
            double recovery = CompoundInterest.CapitalRecovery(i, k);
            costs[k - 1] = valueNow * recovery - marketValues[k - 1] * CompoundInterest.SinkingFund(i, k) + presentOperating * recovery;
            marginal[k - 1] = previousValue * (1.0 + i) - marketValues[k - 1] + operatingCosts[k - 1];
            previousValue = marketValues[k - 1];
        }
        int best = Array.IndexOf(costs, costs.Min()) + 1;
        return new ServiceLife([.. Enumerable.Range(1, years)], costs, marginal, best);
    }

    /// <summary>How many more years to keep the defender (0: replace now) against the challenger's least EAC.</summary>
    public static int YearsToKeep(ServiceLife defender, ServiceLife challenger)
    {
        ArgumentNullException.ThrowIfNull(defender);
        ArgumentNullException.ThrowIfNull(challenger);
        int keep = 0;
        while (keep < defender.MarginalCosts.Count && defender.MarginalCosts[keep] < challenger.LeastAnnualCost)
        {
            keep++;
        }
        return keep;
    }
}
