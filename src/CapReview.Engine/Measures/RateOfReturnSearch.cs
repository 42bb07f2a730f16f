using System.Collections.Concurrent;
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
/// <see cref="FindUnique"/> answers only whether there is exactly one root, and which, for a simulation: it scans the
/// same grid intervals outwards from zero on both sides at once (roots near zero are the likely ones) and stops once
/// two roots are found that the merging of near-duplicates could not join (<see cref="RootTally"/>), with the answer
/// the full scan gives.
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
            _ => EveryRoot(flows, lowest, highest, signs),
        };
        return new RateOfReturnResult(roots, signs.FlowChanges, signs.ForwardCumulativeChanges, signs.CumulativeTestPassed);
    }

    /// <summary>
    /// The rate of return per period when there is exactly one in the range, else null: always
    /// <see cref="Find"/>'s <see cref="RateOfReturnResult.UniqueRoot"/>, found with less work when the flows change
    /// sign several times and have several roots.
    /// </summary>
    public static double? FindUnique(double[] netFlows, double lowest, double highest)
    {
        ArgumentNullException.ThrowIfNull(netFlows);
        if (!(lowest > -1.0) || !(highest > lowest) || !double.IsFinite(highest))
        {
            throw new ArgumentOutOfRangeException(nameof(lowest), "The search range must lie above -100% and be non-empty.");
        }
        FlowSigns signs = FlowSigns.Of(netFlows);
        if (signs.FlowChanges < 2)
        {
            return signs.FlowChanges == 0 ? null : SingleRoot(netFlows, lowest, highest, signs) is [double single] ? single : null;
        }
        // The roots EveryRoot finds, from the same pieces: the zero root, a side's one root, every grid interval's roots.
        var tally = new RootTally(lowest, highest);
        bool zeroIsRoot = Math.Abs(signs.Total) <= ZeroTolerance * signs.Gross;
        if (zeroIsRoot && lowest <= 0.0 && highest >= 0.0)
        {
            tally.Add(0.0);
        }
        SideScan? above = null, below = null;
        if (highest > 0.0 && signs.ForwardCumulativeChanges > 0)
        {
            above = SideScan.Start(netFlows, Math.Max(lowest, 0.0), highest, signs.ForwardCumulativeChanges, zeroIsRoot, signs, tally, downwards: false);
        }
        if (lowest < 0.0 && signs.BackwardCumulativeChanges > 0)
        {
            below = SideScan.Start(netFlows, lowest, Math.Min(highest, 0.0), signs.BackwardCumulativeChanges, zeroIsRoot, signs, tally, downwards: true);
        }
        while (!tally.Settled && (above is { Done: false } || below is { Done: false }))
        {
            SideScan next = below is not { Done: false } || (above is { Done: false } && above.Distance <= below.Distance) ? above! : below;
            next.Step();
        }
        if (tally.Settled)
        {
            return null;
        }
        List<double> roots = tally.Found;
        roots.Sort();
        RemoveNearDuplicates(roots);
        return roots is [double root] ? root : null;
    }

    /// <summary>
    /// One side of zero scanned interval by interval from zero outwards, for <see cref="FindUnique"/>: the intervals,
    /// and what each gives, are those of <see cref="SearchSide"/>; only their order differs.
    /// </summary>
    private sealed class SideScan
    {
        private readonly double[] _flows;
        private readonly double[] _grid;
        private readonly bool _downwards;
        private readonly RootTally _tally;
        private Sample _front;
        private int _next;

        private SideScan(double[] flows, double[] grid, bool downwards, RootTally tally)
        {
            _flows = flows;
            _grid = grid;
            _downwards = downwards;
            _tally = tally;
            int start = downwards ? grid.Length - 1 : 0;
            _front = At(start);
            _next = downwards ? start - 1 : 1;
            if (!downwards && _front.Worth == 0.0)
            {
                tally.Add(_front.Rate);
            }
        }

        /// <summary>The side's scan, or null when the side holds at most one root, which is then found at once.</summary>
        public static SideScan? Start(double[] flows, double from, double to, int bound, bool zeroIsRoot, FlowSigns signs, RootTally tally, bool downwards)
        {
            if (bound > 1)
            {
                return new SideScan(flows, Grid(from, to), downwards, tally);
            }
            if (TryOneSide(flows, from, to, zeroIsRoot, signs, out double root))
            {
                tally.Add(root);
            }
            return null;
        }

        public bool Done => _downwards ? _next < 0 : _next >= _grid.Length;

        /// <summary>How far the scan has gone from zero, in ln(1 + i).</summary>
        public double Distance => Math.Abs(Math.Log(1.0 + _front.Rate));

        public void Step()
        {
            Sample reached = At(_next);
            var (lower, upper) = _downwards ? (reached, _front) : (_front, reached);
            int before = _tally.Found.Count;
            ScanInterval(_flows, lower, upper, Subdivisions, _tally.Found);
            _tally.Scanned(lower.Rate, upper.Rate, before);
            _front = reached;
            _next += _downwards ? -1 : 1;
            // The lowest grid point's own root, which the upward scan takes first.
            if (_downwards && _next < 0 && reached.Worth == 0.0)
            {
                _tally.Add(reached.Rate);
            }
        }

        private Sample At(int k) => new(_grid[k], FlowWorth.NormalizedWorth(_flows, _grid[k]), FlowWorth.NormalizedSlope(_flows, _grid[k]));
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

    private static double[] EveryRoot(double[] flows, double lowest, double highest, FlowSigns signs)
    {
        var roots = new List<double>(4);
        bool zeroIsRoot = Math.Abs(signs.Total) <= ZeroTolerance * signs.Gross;
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
        if (lowest < 0.0 && signs.BackwardCumulativeChanges > 0)
        {
            SearchSide(flows, lowest, Math.Min(highest, 0.0), signs.BackwardCumulativeChanges, zeroIsRoot, signs, roots);
        }
        roots.Sort();
        RemoveNearDuplicates(roots);
        return [.. roots];
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

    private static void SearchSide(double[] flows, double from, double to, int bound, bool zeroIsRoot, FlowSigns signs, List<double> roots)
    {
        if (bound == 1)
        {
            if (TryOneSide(flows, from, to, zeroIsRoot, signs, out double root))
            {
                roots.Add(root);
            }
            return;
        }

        double Worth(double i) => FlowWorth.NormalizedWorth(flows, i);

        double[] grid = Grid(from, to);
        var previous = new Sample(grid[0], Worth(grid[0]), FlowWorth.NormalizedSlope(flows, grid[0]));
        if (previous.Worth == 0.0)
        {
            roots.Add(previous.Rate);
        }
        for (int k = 1; k < grid.Length; k++)
        {
            var next = new Sample(grid[k], Worth(grid[k]), FlowWorth.NormalizedSlope(flows, grid[k]));
            ScanInterval(flows, previous, next, Subdivisions, roots);
            previous = next;
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

    /// <summary>
    /// Grid points from <paramref name="from"/> to <paramref name="to"/>: made once for each range and shared, never
    /// written after it is made. Every search of a model's flows, and every trial of a simulation, searches the same
    /// sides of zero (the range at its period length), and making the grid, an exponential a point, costs more than
    /// the scan that stops early. The cache holds a few dozen ranges at most, so unusual ones cannot grow it.
    /// </summary>
    private static double[] Grid(double from, double to)
    {
        if (Grids.TryGetValue((from, to), out double[]? cached))
        {
            return cached;
        }
        double[] grid = MakeGrid(from, to);
        if (Grids.Count < MaxCachedGrids)
        {
            Grids.TryAdd((from, to), grid);
        }
        return grid;
    }

    private static readonly ConcurrentDictionary<(double From, double To), double[]> Grids = new();
    private const int MaxCachedGrids = 64;

    /// <summary>Grid points from <paramref name="from"/> to <paramref name="to"/>, evenly spaced in ln(1 + i), finer near zero.</summary>
    private static double[] MakeGrid(double from, double to)
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
