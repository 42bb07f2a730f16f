using MathNet.Numerics.RootFinding;

namespace CapReview.Engine.Measures;

/// <summary>
/// Finds every rate of return of a cash-flow sequence: every real root of PW(i) = 0 in a range of rates.
/// <para>
/// The range is split at i = 0. On each side the number of roots is bounded by the sign changes of the cumulative
/// flows (forward for i &gt; 0, from the end for i &lt; 0; Descartes' rule of signs applied to PW(i)/(1 − v), after
/// Pratt and Hammond, 1979). A side with bound 0 has no root; a side with bound 1 has one exactly when the worth
/// differs in sign at its ends, found by Brent's method; a side with a larger bound is scanned on a fine grid in
/// ln(1 + i), and every bracket and every turning point of the worth (where two close roots can hide) is refined.
/// </para>
/// </summary>
public static class RateOfReturnSearch
{
    /// <summary>Lowest annual rate searched: −99.9999%.</summary>
    public const double LowestAnnual = -0.999999;

    /// <summary>Highest annual rate searched: 1000%.</summary>
    public const double HighestAnnual = 10.0;

    private const double Accuracy = 1e-14;
    private const double ZeroTolerance = 1e-10;
    private const double FineStep = 0.005;
    private const double CoarseStep = 0.02;
    private const double FineSpan = 0.7;

    /// <summary>Every root in [<paramref name="lowest"/>, <paramref name="highest"/>], as effective rates per period.</summary>
    public static RateOfReturnResult Find(IReadOnlyList<double> netFlows, double lowest, double highest)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        if (!(lowest > -1.0) || !(highest > lowest) || !double.IsFinite(highest))
        {
            throw new ArgumentOutOfRangeException(nameof(lowest), "The search range must lie above -100% and be non-empty.");
        }
        double[] flows = netFlows as double[] ?? [.. netFlows];
        var signs = FlowSigns.Of(flows);

        var roots = new List<double>(2);
        if (signs.FlowChanges > 0)
        {
            bool zeroIsRoot = Math.Abs(signs.Total) <= ZeroTolerance * signs.Gross;
            if (zeroIsRoot && lowest <= 0.0 && highest >= 0.0)
            {
                roots.Add(0.0);
            }
            if (highest > 0.0 && signs.ForwardCumulativeChanges > 0)
            {
                SearchSide(flows, Math.Max(lowest, 0.0), highest, signs.ForwardCumulativeChanges, zeroIsRoot, signs, roots);
            }
            if (lowest < 0.0 && signs.BackwardCumulativeChanges > 0)
            {
                SearchSide(flows, lowest, Math.Min(highest, 0.0), signs.BackwardCumulativeChanges, zeroIsRoot, signs, roots);
            }
            roots.Sort();
            RemoveNearDuplicates(roots);
        }
        return new RateOfReturnResult(roots, signs.FlowChanges, signs.ForwardCumulativeChanges, signs.CumulativeTestPassed);
    }

    private static void SearchSide(double[] flows, double from, double to, int bound, bool zeroIsRoot, FlowSigns signs, List<double> roots)
    {
        if (bound == 1)
        {
            // At most one root here, and a single root must cross: it is found exactly when the worth differs in sign
            // between the ends. The worth at i = 0 is the plain total; a root at zero is stepped off.
            bool positiveSide = from >= 0.0;
            double zeroEnd = positiveSide ? (zeroIsRoot ? 1e-9 : 0.0) : (zeroIsRoot ? -1e-9 : 0.0);
            double farEnd = positiveSide ? to : from;
            double? worthAtZero = zeroIsRoot ? null : signs.Total;
            double guess = Math.Exp(Math.Log(signs.Receipts / signs.Payments) / signs.MeanTimeGap) - 1.0;
            if (Math.Abs(farEnd - zeroEnd) > 0.0 && SafeguardedNewton.TryFindRoot(flows, zeroEnd, worthAtZero, farEnd, guess, out double root))
            {
                roots.Add(root);
            }
            return;
        }

        double Worth(double i) => FlowWorth.NormalizedWorth(flows, i);

        double[] grid = Grid(from, to);
        double previousRate = grid[0];
        double previousWorth = Worth(previousRate);
        double previousSlope = FlowWorth.NormalizedSlope(flows, previousRate);
        for (int k = 1; k < grid.Length; k++)
        {
            double rate = grid[k];
            double worth = Worth(rate);
            double slope = FlowWorth.NormalizedSlope(flows, rate);
            if (worth == 0.0)
            {
                roots.Add(rate);
            }
            else if (Math.Sign(previousWorth) * Math.Sign(worth) < 0)
            {
                roots.Add(Refine(Worth, previousRate, rate));
            }
            else if (Math.Sign(previousSlope) * Math.Sign(slope) < 0)
            {
                RefineTurningPoint(flows, previousRate, rate, previousWorth, roots);
            }
            previousRate = rate;
            previousWorth = worth;
            previousSlope = slope;
        }
    }

    /// <summary>The worth turns between a and b without changing sign at the ends: it may dip across zero twice, or touch it.</summary>
    private static void RefineTurningPoint(double[] flows, double a, double b, double worthAtA, List<double> roots)
    {
        double Worth(double i) => FlowWorth.NormalizedWorth(flows, i);
        double Slope(double i) => FlowWorth.NormalizedSlope(flows, i);

        double turn = Refine(Slope, a, b);
        double worthAtTurn = Worth(turn);
        if (Math.Sign(worthAtTurn) * Math.Sign(worthAtA) < 0)
        {
            roots.Add(Refine(Worth, a, turn));
            roots.Add(Refine(Worth, turn, b));
        }
        else if (Math.Abs(worthAtTurn) <= ZeroTolerance)
        {
            roots.Add(turn);
        }
    }

    private static double Refine(Func<double, double> f, double a, double b)
    {
        if (Brent.TryFindRoot(f, a, b, Accuracy, 200, out double root))
        {
            return root;
        }
        // Brent stops when it can no longer shrink the bracket; bisection always ends inside it.
        return Bisection.FindRoot(f, a, b, Accuracy, 200);
    }

    /// <summary>Grid points from <paramref name="from"/> to <paramref name="to"/>, evenly spaced in ln(1 + i), finer near zero.</summary>
    private static double[] Grid(double from, double to)
    {
        double u0 = Math.Log(1.0 + from);
        double u1 = Math.Log(1.0 + to);
        var points = new List<double>(256) { from };
        double u = u0;
        while (u < u1)
        {
            u += Math.Abs(u) < FineSpan ? FineStep : CoarseStep;
            points.Add(u >= u1 ? to : Math.Exp(u) - 1.0);
        }
        return [.. points];
    }

    private static void RemoveNearDuplicates(List<double> sorted)
    {
        for (int k = sorted.Count - 1; k > 0; k--)
        {
            if (sorted[k] - sorted[k - 1] <= 1e-9 * Math.Max(1.0, Math.Abs(sorted[k])))
            {
                sorted.RemoveAt(k);
            }
        }
    }
}
