using CapReview.Engine.Numerics;

namespace CapReview.Engine.Factors;

/// <summary>
/// The discrete compound-interest factors, end-of-period convention, rate <c>i</c> per period, <c>n</c> periods.
/// Each is computed through ln(1 + i) and e^x − 1 so that it keeps full precision for rates as small as 1e-9
/// and returns its limit at i = 0. Formulas: the standard factor definitions (NIST Handbook 135, "Life-Cycle
/// Costing Manual for the Federal Energy Management Program", chapter 4 and its discount-factor tables); see docs/methods.md.
/// </summary>
public static class CompoundInterest
{
    /// <summary>Largest number of periods the factors accept.</summary>
    public const int MaxPeriods = 1200;

    /// <summary>(F/P, i, n) = (1 + i)^n, the single-payment compound amount factor. Any integer n.</summary>
    public static double SinglePaymentCompoundAmount(double i, int n)
    {
        CheckRate(i);
        return Math.Exp(n * StableMath.Log1p(i));
    }

    /// <summary>(P/F, i, n) = (1 + i)^−n, the single-payment present worth factor. Any integer n.</summary>
    public static double SinglePaymentPresentWorth(double i, int n)
    {
        CheckRate(i);
        return Math.Exp(-n * StableMath.Log1p(i));
    }

    /// <summary>(F/A, i, n) = ((1 + i)^n − 1) / i, the uniform-series compound amount factor; n at i = 0.</summary>
    public static double UniformSeriesCompoundAmount(double i, int n)
    {
        CheckRate(i);
        CheckPeriods(n, 0);
        return i == 0.0 ? n : StableMath.Expm1(n * StableMath.Log1p(i)) / i;
    }

    /// <summary>(P/A, i, n) = (1 − (1 + i)^−n) / i, the uniform-series present worth factor; n at i = 0.</summary>
    public static double UniformSeriesPresentWorth(double i, int n)
    {
        CheckRate(i);
        CheckPeriods(n, 0);
        return i == 0.0 ? n : -StableMath.Expm1(-n * StableMath.Log1p(i)) / i;
    }

    /// <summary>(A/F, i, n) = i / ((1 + i)^n − 1), the sinking-fund factor; 1/n at i = 0.</summary>
    public static double SinkingFund(double i, int n)
    {
        CheckPeriods(n, 1);
        return 1.0 / UniformSeriesCompoundAmount(i, n);
    }

    /// <summary>(A/P, i, n) = i (1 + i)^n / ((1 + i)^n − 1), the capital-recovery factor; 1/n at i = 0.</summary>
    public static double CapitalRecovery(double i, int n)
    {
        CheckPeriods(n, 1);
        return 1.0 / UniformSeriesPresentWorth(i, n);
    }

    /// <summary>
    /// (P/G, i, n) = ((1 + i)^n − 1 − n i) / (i² (1 + i)^n), the arithmetic-gradient present worth factor:
    /// the worth at time 0 of 0, G, 2G, … (n − 1)G at the ends of periods 1 … n, per unit G; n(n − 1)/2 at i = 0.
    /// Near zero the numerator is formed as x²·E(x) + n·(ln(1 + i) − i) with x = n ln(1 + i) and
    /// E(x) = (e^x − 1 − x)/x², both parts free of cancellation, and divided by i² term by term, so that a vanishing
    /// rate (down to the smallest double) gives the limit n(n − 1)/2 rather than 0/0.
    /// </summary>
    public static double ArithmeticGradientPresentWorth(double i, int n)
    {
        CheckRate(i);
        CheckPeriods(n, 0);
        if (n <= 1)
        {
            return 0.0;
        }
        if (i == 0.0)
        {
            return n * (n - 1) / 2.0;
        }
        double log1p = StableMath.Log1p(i);
        double x = n * log1p;
        if (Math.Abs(x) >= 1.0)
        {
            // Away from zero the textbook form cancels by at most a factor of about 2.5.
            return (UniformSeriesPresentWorth(i, n) - n * SinglePaymentPresentWorth(i, n)) / i;
        }
        // Divided through by i² before summing: i² itself underflows for rates below about 1e-162, where the
        // quotient of the two underflowed parts was 0/0. ln(1 + i)/i and (ln(1 + i) − i)/i² both tend to finite limits.
        double logOverRate = log1p == i ? 1.0 : log1p / i;
        double numerator = (double)n * n * logOverRate * logOverRate * StableMath.Expm1MinusXOverXSquared(x) + n * StableMath.Log1pMinusXOverXSquared(i);
        return numerator / Math.Exp(x);
    }

    /// <summary>(A/G, i, n) = (P/G, i, n)(A/P, i, n), the arithmetic-gradient uniform-series factor; (n − 1)/2 at i = 0.</summary>
    public static double ArithmeticGradientUniformSeries(double i, int n)
    {
        CheckPeriods(n, 1);
        return ArithmeticGradientPresentWorth(i, n) * CapitalRecovery(i, n);
    }

    /// <summary>
    /// (P/A₁, g, i, n) = (1 − ((1 + g)/(1 + i))^n) / (i − g), the geometric-gradient present worth factor: the worth at
    /// time 0 of A₁, A₁(1 + g), … at the ends of periods 1 … n, per unit A₁; n/(1 + i) when i = g.
    /// Computed as (F/A, d, n)/(1 + i) with d = (g − i)/(1 + i), which is exact algebra and keeps precision as g → i.
    /// </summary>
    public static double GeometricGradientPresentWorth(double i, double g, int n)
    {
        CheckRate(i);
        if (!double.IsFinite(g) || g <= -1.0)
        {
            throw new ArgumentOutOfRangeException(nameof(g), g, "The growth rate must be finite and greater than -100%.");
        }
        CheckPeriods(n, 0);
        double d = (g - i) / (1.0 + i);
        if (d > -0.5)
        {
            return UniformSeriesCompoundAmount(d, n) / (1.0 + i);
        }
        // Far below zero, 1 + d = (1 + g)/(1 + i) can round to nothing as a difference from −1 (growth near −100%
        // against a large rate); as a difference of logarithms it keeps its size, and no cancellation is left to fear.
        double log = StableMath.Log1p(g) - StableMath.Log1p(i);
        return n == 0 ? 0.0 : StableMath.Expm1(n * log) / StableMath.Expm1(log) / (1.0 + i);
    }

    internal static void CheckRate(double i)
    {
        if (!double.IsFinite(i) || i <= -1.0)
        {
            throw new ArgumentOutOfRangeException(nameof(i), i, "The rate per period must be finite and greater than -100%.");
        }
    }

    internal static void CheckPeriods(int n, int minimum)
    {
        if (n < minimum || n > MaxPeriods)
        {
            throw new ArgumentOutOfRangeException(nameof(n), n, $"The number of periods must be between {minimum} and {MaxPeriods}.");
        }
    }
}
