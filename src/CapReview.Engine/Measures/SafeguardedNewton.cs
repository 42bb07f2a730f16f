namespace CapReview.Engine.Measures;

/// <summary>
/// The one root of a cash-flow sequence's worth between i = 0 and a far end, where at most one can lie. Halley's method
/// (cubic convergence; the worth, its slope and its curvature from one pass) is kept inside a bracket, falling back to a
/// Newton step and then to bisection whenever a step would leave the bracket or shrink it too slowly, after the
/// safeguarded Newton method "rtsafe" of W. H. Press et al., Numerical Recipes, 3rd ed. (2007), section 9.4. The bracket
/// lies wholly on one side of i = 0, so the worth is one polynomial throughout: the present worth for i ≥ 0, the future
/// worth for i &lt; 0.
/// </summary>
internal static class SafeguardedNewton
{
    private const int MaxIterations = 100;

    /// <summary>
    /// Searches between <paramref name="zeroEnd"/> (at or next to i = 0, with its worth when already known, else NaN) and
    /// <paramref name="farEnd"/>, starting from <paramref name="guess"/>; false when the worth keeps one sign.
    /// <paramref name="limitSign"/> is the sign of the worth beyond the far end; it stands in for the far end's own
    /// until an iterate reaches the far end, which is then evaluated.
    /// </summary>
    public static bool TryFindRoot(ReadOnlySpan<double> flows, double zeroEnd, double worthAtZeroEnd, double farEnd, int limitSign, double guess, out double root)
    {
        bool present = zeroEnd + farEnd >= 0.0;
        double lo = Math.Min(zeroEnd, farEnd), hi = Math.Max(zeroEnd, farEnd);
        double fz = double.IsNaN(worthAtZeroEnd) ? Evaluate(flows, zeroEnd, present).Value : worthAtZeroEnd;
        root = zeroEnd;
        if (fz == 0.0)
        {
            return true;
        }
        double x = double.IsFinite(guess) && guess > lo && guess < hi ? guess : 0.5 * (lo + hi);
        Worth w = Evaluate(flows, x, present);
        root = x;
        if (w.Value == 0.0)
        {
            return true;
        }
        // The bracket: the zero end and the guess when they differ in sign, else the guess and the far end, whose sign
        // is taken as the limit's until checked. With the limit's sign equal to the guess's there is no root here.
        double other = zeroEnd;
        bool farEndChecked = true;
        if (Math.Sign(w.Value) == Math.Sign(fz))
        {
            if (limitSign == Math.Sign(w.Value) || limitSign == 0)
            {
                return false;
            }
            other = farEnd;
            farEndChecked = false;
        }
        // Orient so that the worth is negative at `low` and positive at `high`.
        (double low, double high) = w.Value < 0.0 ? (x, other) : (other, x);
        double previousStep = Math.Abs(other - x);
        for (int k = 0; k < MaxIterations; k++)
        {
            (double step, bool halley) = Step(w, x, low, high, previousStep);
            bool bisect = double.IsNaN(step);
            if (bisect)
            {
                step = x - (low + 0.5 * (high - low));
            }
            x -= step;
            double size = Math.Abs(step);
            double scale = Math.Max(1.0, Math.Abs(x));
            // Once the steps shrink at the method's rate, the error left after a step of size s is about s³ (Halley) or
            // s² (Newton) times a modest constant: below 1e-16 for these sizes, so no further evaluation is needed. A
            // converged step with a non-zero slope lands on a root. Bisection ending at an unchecked far end needs
            // that end's sign.
            if (!bisect && size <= 1e-3 * previousStep && size <= (halley ? 1e-6 : 1e-9) * scale)
            {
                root = x;
                return true;
            }
            if (size <= 4e-16 * scale)
            {
                root = x;
                return farEndChecked || Math.Sign(Evaluate(flows, farEnd, present).Value) != Math.Sign(fz);
            }
            previousStep = size;
            w = Evaluate(flows, x, present);
            if (w.Value == 0.0)
            {
                root = x;
                return true;
            }
            if (w.Value < 0.0)
            {
                low = x;
            }
            else
            {
                high = x;
            }
            farEndChecked |= Math.Sign(w.Value) != Math.Sign(fz);
        }
        root = x;
        return farEndChecked;
    }

    /// <summary>
    /// Halley's step where it agrees with Newton's to within half (near a simple root they agree; near a turning point
    /// Halley's shrinks to nothing while Newton's does not), else Newton's; NaN (bisect) when the step would leave the
    /// bracket or not halve the previous one.
    /// </summary>
    private static (double Step, bool Halley) Step(Worth w, double x, double low, double high, double previousStep)
    {
        double f = w.Value, d1 = w.Slope, d2 = w.Curvature;
        if (d1 == 0.0)
        {
            return (double.NaN, false);
        }
        double newton = f / d1;
        // A Newton step below the last bit of x means x is the root already, even when x is a bracket end.
        if (Math.Abs(newton) <= 4e-16 * Math.Max(1.0, Math.Abs(x)))
        {
            return (newton, false);
        }
        double denominator = 2.0 * d1 * d1 - f * d2;
        double halley = denominator > 0.0 ? 2.0 * f * d1 / denominator : double.NaN;
        bool useHalley = Math.Abs(halley - newton) <= 0.5 * Math.Abs(newton);
        double step = useHalley ? halley : newton;
        return Inside(x - step, low, high) && Math.Abs(step) < 0.5 * previousStep ? (step, useHalley) : (double.NaN, false);
    }

    private static bool Inside(double x, double low, double high) => x > Math.Min(low, high) && x < Math.Max(low, high);

    private readonly record struct Worth(double Value, double Slope, double Curvature);

    /// <summary>The worth and its first two derivatives in i.</summary>
    private static Worth Evaluate(ReadOnlySpan<double> flows, double i, bool present)
    {
        if (present)
        {
            // PW = P(v), v = 1/(1 + i), dv/di = −v²: PW′ = −v² P′(v), PW″ = 2v³ P′(v) + v⁴ P″(v).
            double v = 1.0 / (1.0 + i);
            Worth p = Polynomial(flows, v, reversed: false);
            double v2 = v * v;
            return new Worth(p.Value, -v2 * p.Slope, v2 * (2.0 * v * p.Slope + v2 * p.Curvature));
        }
        // FW = P(x) with coefficients F_(n−j), x = 1 + i.
        return Polynomial(flows, 1.0 + i, reversed: true);
    }

    /// <summary>
    /// P(z) = Σ c_k z^k with P′ and P″, as E(z²) + z O(z²): the even and odd coefficients in independent Horner chains
    /// (half the latency of one chain), fused multiply-adds; c_k = flows[k], or flows[n − k] when reversed.
    /// P′ = 2zE′ + O + 2z²O′ and P″ = 2E′ + 4z²E″ + 6zO′ + 4z³O″, with E′, E″, O′, O″ taken in z².
    /// </summary>
    private static Worth Polynomial(ReadOnlySpan<double> flows, double z, bool reversed)
    {
        int n = flows.Length - 1;
        double w = z * z;
        double e = 0.0, e1 = 0.0, e2 = 0.0, o = 0.0, o1 = 0.0, o2 = 0.0;
        // With n even the top coefficient is even and has no odd partner: it starts the even chain.
        int m = n / 2;
        if (n % 2 == 0)
        {
            e = reversed ? flows[0] : flows[n];
            m--;
        }
        if (reversed)
        {
            for (; m >= 0; m--)
            {
                int k = n - 2 * m;
                e2 = Math.FusedMultiplyAdd(e2, w, e1);
                o2 = Math.FusedMultiplyAdd(o2, w, o1);
                e1 = Math.FusedMultiplyAdd(e1, w, e);
                o1 = Math.FusedMultiplyAdd(o1, w, o);
                e = Math.FusedMultiplyAdd(e, w, flows[k]);
                o = Math.FusedMultiplyAdd(o, w, flows[k - 1]);
            }
        }
        else
        {
            for (; m >= 0; m--)
            {
                int k = 2 * m;
                e2 = Math.FusedMultiplyAdd(e2, w, e1);
                o2 = Math.FusedMultiplyAdd(o2, w, o1);
                e1 = Math.FusedMultiplyAdd(e1, w, e);
                o1 = Math.FusedMultiplyAdd(o1, w, o);
                e = Math.FusedMultiplyAdd(e, w, flows[k]);
                o = Math.FusedMultiplyAdd(o, w, flows[k + 1]);
            }
        }
        // Horner's second accumulator holds half the second derivative.
        e2 *= 2.0;
        o2 *= 2.0;
        return new Worth(
            Math.FusedMultiplyAdd(z, o, e),
            2.0 * z * e1 + o + 2.0 * w * o1,
            2.0 * e1 + 4.0 * w * e2 + 6.0 * z * o1 + 4.0 * z * w * o2);
    }
}
