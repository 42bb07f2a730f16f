using MathNet.Numerics.RootFinding;

namespace CapReview.Engine.Risk;

/// <summary>
/// The value of one input at which the measure is zero (or two proposals are worth the same), the other inputs as
/// they are: a scan of the range for a sign change, then Brent's method. None when the measure keeps its sign.
/// </summary>
public static class BreakEven
{
    private const int Steps = 200;

    /// <summary>The break-even value of <paramref name="target"/> in [<paramref name="low"/>, <paramref name="high"/>] nearest the current value, or null.</summary>
    public static double? Find(ProposalCase proposal, string target, double low, double high, RiskMeasure measure = RiskMeasure.PresentWorth)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        return Root(v => proposal.With(target, v).Measure(measure), low, high, proposal.ValueAt(target));
    }

    /// <summary>The value of <paramref name="target"/> (in the first proposal) at which the two proposals' measures are equal, or null.</summary>
    public static double? Between(ProposalCase first, ProposalCase second, string target, double low, double high, RiskMeasure measure = RiskMeasure.AnnualWorth)
    {
        ArgumentNullException.ThrowIfNull(first);
        ArgumentNullException.ThrowIfNull(second);
        double other = second.Measure(measure);
        return Root(v => first.With(target, v).Measure(measure) - other, low, high, first.ValueAt(target));
    }

    private static double? Root(Func<double, double> f, double low, double high, double? near)
    {
        if (!(high > low) || !double.IsFinite(low) || !double.IsFinite(high))
        {
            throw new ArgumentOutOfRangeException(nameof(low), "The range must be finite and not empty.");
        }
        var roots = new List<double>();
        double previousX = low, previous = f(low);
        for (int k = 1; k <= Steps; k++)
        {
            double x = low + (high - low) * k / Steps, y = f(x);
            if (previous == 0)
            {
                roots.Add(previousX);
            }
            else if (double.IsFinite(previous) && double.IsFinite(y) && Math.Sign(previous) * Math.Sign(y) < 0
                && Brent.TryFindRoot(f, previousX, x, 1e-12 * Math.Max(1, Math.Abs(x)), 200, out double root))
            {
                roots.Add(root);
            }
            (previousX, previous) = (x, y);
        }
        if (previous == 0)
        {
            roots.Add(high);
        }
        if (roots.Count == 0)
        {
            return null;
        }
        double centre = near ?? (low + high) / 2;
        return roots.MinBy(r => Math.Abs(r - centre));
    }
}
