using MathNet.Numerics.RootFinding;

namespace CapReview.Engine.Measures;

/// <summary>
/// Finds every rate of return of a cash-flow sequence: every real root of PW(i) = 0 in a range of rates.
/// <para>
/// The range is split at i = 0. On each side the number of roots is bounded by the sign changes of the cumulative
/// flows (forward for i &gt; 0, from the end for i &lt; 0; Descartes' rule of signs applied to PW(i)/(1 − v), after
/// Pratt and Hammond, 1979). A side with bound 0 has no root; a side with bound 1 has one exactly when the worth
/// differs in sign at its ends, found by a safeguarded Halley iteration; a side with a larger bound is scanned on a fine
/// grid in ln(1 + i), and every bracket and every turning point of the worth (where two close roots can hide) is
/// refined by Brent's method.
/// </para>
/// <para>
/// <see cref="FindUnique"/> answers only whether there is exactly one root, and which: the scan stops once two roots
/// are found that the merging of near-duplicates could not join (<see cref="RootTally"/>), with the answer the full
/// scan gives.
/// </para>
/// </summary>
public static class RateOfReturnSearch
{
    /// <summary>Lowest annual rate searched: −99.9999%.</summary>
    public const double LowestAnnual = -0.999999;

    /// <summary>Highest annual rate searched: 1000%.</summary>
    public const double HighestAnnual = 10.0;

    private const double FunctionAccuracy = 1e-300;
    private const double ZeroTolerance = 1e-10;

    // A turning point counts as a double root only when the normalized worth there is zero to rounding, about
    // 64 ε per term: two distinct roots a hair apart dip further than that.
    private const double TouchTolerance = 1.4e-14;
    // Grid steps in u = ln(1 + i): 0.0025 for rates between −78% and 348%, 0.01 out to −95% and 1909%, 0.02 beyond.
    private const double FineStep = 0.0025;
    private const double FineSpan = 1.5;
    private const double MiddleStep = 0.01;
    private const double MiddleSpan = 3.0;
    private const double CoarseStep = 0.02;
    private const int Subdivisions = 3;
    private const int SplitParts = 8;

    /// <summary>Every root in [<paramref name="lowest"/>, <paramref name="highest"/>], as effective rates per period.</summary>
    public static RateOfReturnResult Find(IReadOnlyList<double> netFlows, double lowest, double highest)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        if (!(lowest > -1.0) || !(highest > lowest) || !double.IsFinite(highest))
        {
            throw new ArgumentOutOfRangeException(nameof(lowest), "The search range must lie above -100% and be non-empty.");
        }
        double[] flows = netFlows as double[] ?? [.. netFlows];
        FlowSigns signs = FlowSigns.Of(flows);
        double[] roots = signs.FlowChanges switch
        {
            0 => [],
            1 => SingleRoot(flows, lowest, highest, signs),
            _ => EveryRoot(flows, lowest, highest, signs, new RootTally(lowest, highest, stopAtSecond: false)) ?? [],
        };
        return new RateOfReturnResult(roots, signs.FlowChanges, signs.ForwardCumulativeChanges, signs.CumulativeTestPassed);
    }

    /// <summary>
    /// The rate of return when there is exactly one in the range, else null: always <see cref="Find"/>'s
    /// <see cref="RateOfReturnResult.UniqueRoot"/>, but the scan of flows with several sign changes stops as soon as
    /// two roots are found that no later root could merge into one (see <see cref="RootTally"/>). For a simulation,
    /// which keeps only a unique rate.
    /// </summary>
    public static double? FindUnique(double[] netFlows, double lowest, double highest)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        if (!(lowest > -1.0) || !(highest > lowest) || !double.IsFinite(highest))
        {
            throw new ArgumentOutOfRangeException(nameof(lowest), "The search range must lie above -100% and be non-empty.");
        }
        FlowSigns signs = FlowSigns.Of(netFlows);
        double[]? roots = signs.FlowChanges switch
        {
            0 => [],
            1 => SingleRoot(netFlows, lowest, highest, signs),
            _ => EveryRoot(netFlows, lowest, highest, signs, new RootTally(lowest, highest, stopAtSecond: true)),
        };
        return roots is [double root] ? root : null;
    }

    /// <summary>
    /// One sign change: exactly one root above −100% (Descartes). It is positive when the worth at zero has the sign of
    /// the last flow, which the worth takes as i → −100%, and negative otherwise.
    /// </summary>
    private static double[] SingleRoot(double[] flows, double lowest, double highest, FlowSigns signs)
    {
        bool zeroIsRoot = Math.Abs(signs.Total) <= ZeroTolerance * signs.Gross;
        if (zeroIsRoot)
        {
            return lowest <= 0.0 && highest >= 0.0 ? [0.0] : [];
        }
        bool positive = Math.Sign(signs.Total) == signs.LastSign;
        if (positive ? highest <= 0.0 : lowest >= 0.0)
        {
            return [];
        }
        double from = positive ? Math.Max(lowest, 0.0) : lowest;
        double to = positive ? highest : Math.Min(highest, 0.0);
        return TryOneSide(flows, from, to, zeroIsRoot: false, signs, out double root) ? [root] : [];
    }

    /// <summary>Every root, ascending; null when the tally stopped the scan at a second root.</summary>
    private static double[]? EveryRoot(double[] flows, double lowest, double highest, FlowSigns signs, RootTally roots)
    {
        bool zeroIsRoot = Math.Abs(signs.Total) <= ZeroTolerance * signs.Gross;
        // Zero is the lowest rate of the side above it, which is scanned first.
        roots.BeginSide(rootsAbove: false, descending: false);
        if (zeroIsRoot && lowest <= 0.0 && highest >= 0.0)
        {
            roots.Add(0.0);
        }
        // Bounds on the roots each side of zero: the sign changes of the running sums from the start (i > 0) and
        // from the end (i < 0).
        if (highest > 0.0 && signs.ForwardCumulativeChanges > 0)
        {
            SearchSide(flows, Math.Max(lowest, 0.0), highest, signs.ForwardCumulativeChanges, zeroIsRoot, signs, roots);
        }
        if (lowest < 0.0 && signs.BackwardCumulativeChanges > 0 && !roots.Settled)
        {
            // When only a unique root matters the side below zero is scanned downwards: rates just below zero are
            // far likelier roots than rates near −100%, and a root found above zero then settles the answer at once.
            roots.BeginSide(rootsAbove: roots.Found.Count > 0, descending: roots.StopAtSecond);
            SearchSide(flows, lowest, Math.Min(highest, 0.0), signs.BackwardCumulativeChanges, zeroIsRoot, signs, roots);
        }
        if (roots.Settled)
        {
            return null;
        }
        List<double> found = roots.Found;
        found.Sort();
        RemoveNearDuplicates(found);
        return [.. found];
    }

    /// <summary>
    /// The root on a side of zero that holds at most one, found exactly when the worth differs in sign between the
    /// side's ends. The worth at i = 0 is the plain total; a root at zero is stepped off.
    /// </summary>
    private static bool TryOneSide(double[] flows, double from, double to, bool zeroIsRoot, FlowSigns signs, out double root)
    {
        bool positiveSide = from >= 0.0;
        double zeroEnd = positiveSide ? (zeroIsRoot ? 1e-9 : from) : (zeroIsRoot ? -1e-9 : to);
        double farEnd = positiveSide ? to : from;
        double worthAtZero = zeroIsRoot || zeroEnd != 0.0 ? double.NaN : signs.Total;
        // The sign the worth takes beyond the far end: that of the first flow as i → ∞, of the last as i → −100%.
        int limitSign = positiveSide ? signs.FirstSign : signs.LastSign;
        double guess = Math.Exp(Math.Log(signs.Receipts / signs.Payments) / signs.MeanTimeGap) - 1.0;
        root = double.NaN;
        return Math.Abs(farEnd - zeroEnd) > 0.0
            && SafeguardedNewton.TryFindRoot(flows, zeroEnd, worthAtZero, farEnd, limitSign, guess, out root);
    }

    private static void SearchSide(double[] flows, double from, double to, int bound, bool zeroIsRoot, FlowSigns signs, RootTally roots)
    {
        if (bound == 1)
        {
            if (TryOneSide(flows, from, to, zeroIsRoot, signs, out double root))
            {
                roots.Add(root);
            }
            return;
        }

        double[] grid = Grid(from, to);
        Sample At(int k) => new(grid[k], FlowWorth.NormalizedWorth(flows, grid[k]), FlowWorth.NormalizedSlope(flows, grid[k]));
        void Interval(Sample lower, Sample upper)
        {
            int before = roots.Found.Count;
            ScanInterval(flows, lower, upper, Subdivisions, roots.Found);
            roots.Scanned(lower.Rate, upper.Rate, roots.Found.Count - before);
        }

        if (!roots.Descending)
        {
            Sample previous = At(0);
            if (previous.Worth == 0.0)
            {
                roots.Add(previous.Rate);
            }
            for (int k = 1; k < grid.Length && !roots.Settled; k++)
            {
                Sample next = At(k);
                Interval(previous, next);
                previous = next;
            }
            return;
        }
        // The same intervals from the top down: each gives the roots it gives in the upward scan.
        Sample upper = At(grid.Length - 1);
        for (int k = grid.Length - 1; k >= 1 && !roots.Settled; k--)
        {
            Sample lower = At(k - 1);
            Interval(lower, upper);
            upper = lower;
        }
        if (!roots.Settled && upper.Worth == 0.0)
        {
            roots.Add(upper.Rate);
        }
    }

    private readonly record struct Sample(double Rate, double Worth, double Slope);

    /// <summary>
    /// Roots between two samples. Where the slope keeps its sign the worth crosses zero at most once in practice and a
    /// sign change is refined directly; where the slope changes sign, several roots may hide (two close ones, or three
    /// around a crossing), so the interval is split and each part scanned again, down to a fixed depth, where a
    /// turning point without a crossing is refined and tested.
    /// </summary>
    private static void ScanInterval(double[] flows, Sample a, Sample b, int depth, List<double> roots)
    {
        double Worth(double i) => FlowWorth.NormalizedWorth(flows, i);

        if (b.Worth == 0.0)
        {
            roots.Add(b.Rate);
            return;
        }
        bool crosses = Math.Sign(a.Worth) * Math.Sign(b.Worth) < 0;
        bool turns = Math.Sign(a.Slope) * Math.Sign(b.Slope) < 0;
        if (turns && depth > 0)
        {
            Sample left = a;
            for (int k = 1; k <= SplitParts; k++)
            {
                double rate = k == SplitParts ? b.Rate : a.Rate + (b.Rate - a.Rate) * k / SplitParts;
                Sample right = k == SplitParts ? b : new Sample(rate, Worth(rate), FlowWorth.NormalizedSlope(flows, rate));
                ScanInterval(flows, left, right, depth - 1, roots);
                left = right;
            }
            return;
        }
        if (crosses)
        {
            roots.Add(Refine(Worth, a.Rate, b.Rate));
        }
        else if (turns)
        {
            RefineTurningPoint(flows, a.Rate, b.Rate, a.Worth, roots);
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
        else if (Math.Abs(worthAtTurn) <= TouchTolerance * flows.Length)
        {
            roots.Add(turn);
        }
    }

    /// <summary>
    /// Brent's method to the last bit of the rate. Its test on |f| is set below any worth that is not exactly zero,
    /// because near a cluster of roots the normalized worth is tiny over a wide span of rates.
    /// </summary>
    private static double Refine(Func<double, double> f, double a, double b)
    {
        if (Brent.TryFindRoot(f, a, b, FunctionAccuracy, 300, out double root))
        {
            return root;
        }
        // Brent stops when it can no longer shrink the bracket; plain bisection always ends inside it.
        double fa = f(a);
        for (int k = 0; k < 1100; k++)
        {
            double mid = 0.5 * (a + b);
            if (mid <= Math.Min(a, b) || mid >= Math.Max(a, b))
            {
                break;
            }
            double fm = f(mid);
            if (fm == 0.0)
            {
                return mid;
            }
            if (Math.Sign(fm) == Math.Sign(fa))
            {
                a = mid;
                fa = fm;
            }
            else
            {
                b = mid;
            }
        }
        return 0.5 * (a + b);
    }

    /// <summary>Grid points from <paramref name="from"/> to <paramref name="to"/>, evenly spaced in ln(1 + i), finer near zero.</summary>
    private static double[] Grid(double from, double to)
    {
        double u0 = Math.Log(1.0 + from);
        double u1 = Math.Log(1.0 + to);
        var points = new List<double>(1024) { from };
        double u = u0;
        while (u < u1)
        {
            double size = Math.Abs(u);
            u += size < FineSpan ? FineStep : size < MiddleSpan ? MiddleStep : CoarseStep;
            points.Add(u >= u1 ? to : Math.Exp(u) - 1.0);
        }
        return [.. points];
    }

    /// <summary>
    /// Roots within 1e-7 of each other are one root: a double root whose rounded coefficients split it into two
    /// crossings a hair apart (or the same root found from two grid intervals). They merge at their midpoint.
    /// </summary>
    private static void RemoveNearDuplicates(List<double> sorted)
    {
        for (int k = sorted.Count - 1; k > 0; k--)
        {
            if (sorted[k] - sorted[k - 1] <= 1e-7 * Math.Max(1.0, Math.Abs(sorted[k])))
            {
                sorted[k - 1] = 0.5 * (sorted[k - 1] + sorted[k]);
                sorted.RemoveAt(k);
            }
        }
    }
}
