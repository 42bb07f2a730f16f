using CapReview.Engine.Rates;

namespace CapReview.Engine.Measures;

/// <summary>One point of a present worth profile: an annual effective rate and the present worth at it.</summary>
public readonly record struct ProfilePoint(double AnnualRate, double PresentWorth);

/// <summary>Present worth against the annual effective rate, for the profile chart.</summary>
public static class PresentWorthProfile
{
    /// <summary><paramref name="points"/> evenly spaced annual effective rates from <paramref name="fromAnnual"/> to <paramref name="toAnnual"/>.</summary>
    public static IReadOnlyList<ProfilePoint> Compute(IReadOnlyList<double> netFlows, int periodsPerYear, double fromAnnual, double toAnnual, int points)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        if (points < 2 || !(fromAnnual > -1.0) || !(toAnnual > fromAnnual) || !double.IsFinite(toAnnual))
        {
            throw new ArgumentOutOfRangeException(nameof(points), "A profile needs at least two points over a non-empty range above -100%.");
        }
        double[] flows = [.. netFlows];
        var profile = new ProfilePoint[points];
        for (int k = 0; k < points; k++)
        {
            double annual = fromAnnual + (toAnnual - fromAnnual) * k / (points - 1);
            double perPeriod = AnnualRate.PeriodFromAnnualEffective(annual, periodsPerYear);
            profile[k] = new ProfilePoint(annual, FlowWorth.PresentWorth(flows, perPeriod));
        }
        return profile;
    }
}
