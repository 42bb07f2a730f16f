namespace CapReview.Engine.Numerics;

/// <summary>
/// Elementary functions that stay accurate near zero, where the direct formulas cancel.
/// .NET's <c>double.LogP1</c> and <c>double.ExpM1</c> are computed as <c>Log(1 + x)</c> and <c>Exp(x) - 1</c>,
/// which lose every digit of a rate such as 1e-9; these do not.
/// </summary>
internal static class StableMath
{
    /// <summary>ln(1 + x). Goldberg (1991), "What every computer scientist should know about floating-point arithmetic", Theorem 4.</summary>
    public static double Log1p(double x)
    {
        double u = 1.0 + x;
        if (u == 1.0)
        {
            return x;
        }
        return Math.Log(u) * x / (u - 1.0);
    }

    /// <summary>e^x − 1. Kahan's method, as given by Higham, "Accuracy and Stability of Numerical Algorithms" (2002), section 1.14.1.</summary>
    public static double Expm1(double x)
    {
        double u = Math.Exp(x);
        if (u == 1.0)
        {
            return x;
        }
        double um1 = u - 1.0;
        if (um1 == -1.0)
        {
            return -1.0;
        }
        if (double.IsPositiveInfinity(u))
        {
            return u;
        }
        return um1 * x / Math.Log(u);
    }

    /// <summary>(e^x − 1 − x) / x², by its Taylor series near zero (Σ x^k / (k + 2)!), directly elsewhere.</summary>
    public static double Expm1MinusXOverXSquared(double x)
    {
        if (Math.Abs(x) >= 0.5)
        {
            return (Expm1(x) - x) / (x * x);
        }
        double term = 0.5;
        double sum = term;
        for (int k = 1; k < 40; k++)
        {
            term *= x / (k + 2);
            sum += term;
            if (Math.Abs(term) < 1e-17 * Math.Abs(sum))
            {
                break;
            }
        }
        return sum;
    }

    /// <summary>
    /// (ln(1 + x) − x) / x², by its Taylor series near zero (Σ (−1)^(k+1) x^(k−2) / k, k ≥ 2), which tends to −1/2 and
    /// never forms x² (that underflows to zero for |x| below about 1e-162); directly elsewhere.
    /// </summary>
    public static double Log1pMinusXOverXSquared(double x)
    {
        if (Math.Abs(x) >= 0.1)
        {
            return (Log1p(x) - x) / (x * x);
        }
        double power = 1.0;
        double sum = 0.0;
        for (int k = 2; k < 60; k++)
        {
            double term = power / k;
            sum += (k % 2 == 0) ? -term : term;
            if (Math.Abs(term) < 1e-17 * Math.Abs(sum))
            {
                break;
            }
            power *= x;
        }
        return sum;
    }
}
