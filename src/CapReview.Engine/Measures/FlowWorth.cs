namespace CapReview.Engine.Measures;

/// <summary>
/// Worth of a sequence of net flows F₀ … Fₙ at an effective rate per period, by Horner's rule
/// (one multiply-add per period, no powers). Common practice, no source.
/// </summary>
public static class FlowWorth
{
    /// <summary>Σ F_t (1 + i)^−t.</summary>
    public static double PresentWorth(ReadOnlySpan<double> flows, double i)
    {
        double v = 1.0 / (1.0 + i);
        double sum = 0.0;
        for (int t = flows.Length - 1; t >= 0; t--)
        {
            sum = sum * v + flows[t];
        }
        return sum;
    }

    /// <summary>Σ F_t (1 + i)^(n − t).</summary>
    public static double FutureWorth(ReadOnlySpan<double> flows, double i)
    {
        double x = 1.0 + i;
        double sum = 0.0;
        for (int t = 0; t < flows.Length; t++)
        {
            sum = sum * x + flows[t];
        }
        return sum;
    }

    /// <summary>
    /// A function with the sign and the roots of the present worth that never overflows on (−100%, ∞): the present
    /// worth where i ≥ 0 (powers of 1/(1 + i) ≤ 1) and the future worth where i &lt; 0 (powers of 1 + i &lt; 1).
    /// The two differ by the positive factor (1 + i)^n and meet at i = 0.
    /// </summary>
    public static double ScaledWorth(ReadOnlySpan<double> flows, double i) =>
        i >= 0.0 ? PresentWorth(flows, i) : FutureWorth(flows, i);

    /// <summary>Σ |F_t| (1 + i)^−t or its future-worth twin: the scale against which a worth counts as zero.</summary>
    public static double ScaledGross(ReadOnlySpan<double> flows, double i)
    {
        double sum = 0.0;
        if (i >= 0.0)
        {
            double v = 1.0 / (1.0 + i);
            for (int t = flows.Length - 1; t >= 0; t--)
            {
                sum = sum * v + Math.Abs(flows[t]);
            }
        }
        else
        {
            double x = 1.0 + i;
            for (int t = 0; t < flows.Length; t++)
            {
                sum = sum * x + Math.Abs(flows[t]);
            }
        }
        return sum;
    }

    /// <summary>
    /// <see cref="ScaledWorth"/> divided by <see cref="ScaledGross"/>: same sign and roots, always within [−1, 1], so
    /// that a root finder's test |f| &lt; ε means the same thing for flows of any size.
    /// </summary>
    public static double NormalizedWorth(ReadOnlySpan<double> flows, double i)
    {
        double sum = 0.0;
        double gross = 0.0;
        if (i >= 0.0)
        {
            double v = 1.0 / (1.0 + i);
            for (int t = flows.Length - 1; t >= 0; t--)
            {
                sum = sum * v + flows[t];
                gross = gross * v + Math.Abs(flows[t]);
            }
        }
        else
        {
            double x = 1.0 + i;
            for (int t = 0; t < flows.Length; t++)
            {
                sum = sum * x + flows[t];
                gross = gross * x + Math.Abs(flows[t]);
            }
        }
        return gross == 0.0 ? 0.0 : sum / gross;
    }

    /// <summary>
    /// The sign-carrying slope d/di of <see cref="ScaledWorth"/>, divided by its gross counterpart (|F_t| in place of
    /// F_t): used to find where the worth turns without crossing zero.
    /// </summary>
    internal static double NormalizedSlope(ReadOnlySpan<double> flows, double i)
    {
        int n = flows.Length - 1;
        double sum = 0.0;
        double gross = 0.0;
        if (i >= 0.0)
        {
            // d/di Σ F_t v^t = −v² Σ t F_t v^(t−1).
            double v = 1.0 / (1.0 + i);
            for (int t = n; t >= 1; t--)
            {
                sum = sum * v + t * flows[t];
                gross = gross * v + t * Math.Abs(flows[t]);
            }
            sum = -sum;
        }
        else
        {
            // d/di Σ F_t x^(n−t) = Σ (n − t) F_t x^(n−t−1).
            double x = 1.0 + i;
            for (int t = 0; t < n; t++)
            {
                sum = sum * x + (n - t) * flows[t];
                gross = gross * x + (n - t) * Math.Abs(flows[t]);
            }
        }
        return gross == 0.0 ? 0.0 : sum / gross;
    }
}
