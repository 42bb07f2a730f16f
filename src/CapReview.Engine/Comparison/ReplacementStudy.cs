namespace CapReview.Engine.Comparison;

/// <summary>One year of an asset's estimates: its market value at the end of the year and its operating cost in the year.</summary>
public sealed record ServiceYear(double MarketValue, double OperatingCost);

/// <summary>The defender's and the challenger's economic service lives and what to do.</summary>
/// <param name="Defender">The asset in service, from its market value now.</param>
/// <param name="Challenger">The replacement, from its first cost.</param>
/// <param name="YearsToKeep">Years to keep the defender before replacing it (0: replace now).</param>
/// <param name="NextYearCost">The marginal cost of keeping the defender one more year.</param>
/// <param name="Recommendation">The advice in words.</param>
public sealed record ReplacementAdvice(ServiceLife Defender, ServiceLife Challenger, int YearsToKeep, double NextYearCost, string Recommendation);

/// <summary>
/// Replacement timing: keep the defender while the marginal cost of its next year is below the challenger's least
/// equivalent annual cost. Common practice, no source; see docs/methods.md.
/// </summary>
public static class ReplacementStudy
{
    public static ReplacementAdvice Advise(double defenderValueNow, IReadOnlyList<ServiceYear> defender,
        double challengerFirstCost, IReadOnlyList<ServiceYear> challenger, double annualRate)
    {
        ArgumentNullException.ThrowIfNull(defender);
        ArgumentNullException.ThrowIfNull(challenger);
        ServiceLife d = EconomicServiceLife.Of(defenderValueNow, [.. defender.Select(y => y.MarketValue)], [.. defender.Select(y => y.OperatingCost)], annualRate);
        ServiceLife c = EconomicServiceLife.Of(challengerFirstCost, [.. challenger.Select(y => y.MarketValue)], [.. challenger.Select(y => y.OperatingCost)], annualRate);
        int keep = EconomicServiceLife.YearsToKeep(d, c);
        string advice = keep switch
        {
            0 => "Replace now: keeping the asset in service one more year costs more than the challenger's least annual cost.",
            _ when keep == d.Years.Count => $"Keep for at least {keep} more years: every estimated year costs less than the challenger's least annual cost; estimate further years to time the replacement.",
            1 => "Keep for 1 more year, then replace.",
            _ => $"Keep for {keep} more years, then replace.",
        };
        return new ReplacementAdvice(d, c, keep, d.MarginalCosts[0], advice);
    }
}
