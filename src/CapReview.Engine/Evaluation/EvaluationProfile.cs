using CapReview.Engine.Measures;

namespace CapReview.Engine.Evaluation;

/// <summary>The present worth profile to show beside an evaluation: one range for screens and packets alike.</summary>
public static class EvaluationProfile
{
    /// <summary>From 0% (or the lowest root) to beyond both the MARR and the highest root, so that every crossing shows.</summary>
    public static IReadOnlyList<ProfilePoint> Of(Evaluation result, int points = 121)
    {
        ArgumentNullException.ThrowIfNull(result);
        double marr = result.Marr.EffectiveAnnual();
        double highest = Math.Max(marr, result.RatesOfReturn.Count > 0 ? result.RatesOfReturn[^1] : 0.0);
        double lowest = Math.Min(0.0, result.RatesOfReturn.Count > 0 ? result.RatesOfReturn[0] : 0.0);
        double to = Math.Min(RateOfReturnSearch.HighestAnnual, Math.Max(0.30, highest * 1.5 + 0.05));
        double from = Math.Max(-0.95, lowest - (lowest < 0 ? 0.05 : 0.0));
        // Far below the MARR a long model's worth can pass every double; those points are left off the chart, which
        // always keeps the points near 0% and the MARR.
        return [.. PresentWorthProfile.Compute(result.NetFlows, result.Model.PeriodsPerYear, from, to, points).Where(p => double.IsFinite(p.PresentWorth))];
    }
}
