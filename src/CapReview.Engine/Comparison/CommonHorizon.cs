using CapReview.Engine.Factors;

namespace CapReview.Engine.Comparison;

/// <summary>
/// Flows repeated over a common horizon: each life renewed on the same terms until the least common multiple of the
/// lives (the repeatability assumption under which annual worth compares unequal lives fairly; common practice, no
/// source). Where a renewal's first flow meets the previous life's last, the two are added.
/// </summary>
public static class CommonHorizon
{
    /// <summary>The least common multiple of the lives, or null beyond the 1,200-period limit.</summary>
    public static int? LeastCommonMultiple(IEnumerable<int> lives)
    {
        ArgumentNullException.ThrowIfNull(lives);
        long lcm = 1;
        foreach (int life in lives)
        {
            if (life < 1)
            {
                throw new ArgumentOutOfRangeException(nameof(lives), life, "A life is at least one period.");
            }
            lcm = lcm / Gcd(lcm, life) * life;
            if (lcm > CompoundInterest.MaxPeriods)
            {
                return null;
            }
        }
        return (int)lcm;
    }

    /// <summary>The flows of one life (periods 0 … n) repeated to cover periods 0 … <paramref name="horizon"/>, a multiple of n.</summary>
    public static double[] Repeat(IReadOnlyList<double> flows, int horizon)
    {
        ArgumentNullException.ThrowIfNull(flows);
        int life = flows.Count - 1;
        if (life < 1 || horizon % life != 0)
        {
            throw new ArgumentOutOfRangeException(nameof(horizon), horizon, "The horizon must be a whole number of lives.");
        }
        var repeated = new double[horizon + 1];
        for (int start = 0; start < horizon; start += life)
        {
            for (int t = 0; t <= life; t++)
            {
                repeated[start + t] += flows[t];
            }
        }
        return repeated;
    }

    /// <summary>
    /// What one life's present worth becomes when the life is renewed like for like up to <paramref name="horizon"/>
    /// periods (a multiple of the life): Σ over renewals j of (1 + i)^(−jn) = (1 + i_n)(P/A, i_n, horizon / n), with
    /// i_n = (1 + i)^n − 1 the rate per life. The present worth of the repeated chain is one life's present worth times this.
    /// </summary>
    public static double Renewals(double ratePerPeriod, int life, int horizon)
    {
        if (life < 1 || horizon < life || horizon % life != 0)
        {
            throw new ArgumentOutOfRangeException(nameof(horizon), horizon, "The horizon must be a whole number of lives.");
        }
        double perLife = Numerics.StableMath.Expm1(life * Numerics.StableMath.Log1p(ratePerPeriod));
        return CompoundInterest.UniformSeriesPresentWorth(perLife, horizon / life) * (1.0 + perLife);
    }

    private static long Gcd(long a, long b)
    {
        while (b != 0)
        {
            (a, b) = (b, a % b);
        }
        return a;
    }
}
