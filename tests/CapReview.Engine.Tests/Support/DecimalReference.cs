namespace CapReview.Engine.Tests.Support;

/// <summary>
/// Factors by direct summation in System.Decimal (28 significant digits): a reference independent of the engine's
/// closed forms, precise enough to expose cancellation at rates like 1e-9. Common practice, no source.
/// </summary>
internal static class DecimalReference
{
    /// <summary>Σ_{k=1..n} (1 + i)^−k.</summary>
    public static double UniformSeriesPresentWorth(decimal i, int n)
    {
        decimal v = 1m / (1m + i);
        decimal power = 1m;
        decimal sum = 0m;
        for (int k = 1; k <= n; k++)
        {
            power *= v;
            sum += power;
        }
        return (double)sum;
    }

    /// <summary>Σ_{k=1..n} (k − 1)(1 + i)^−k.</summary>
    public static double ArithmeticGradientPresentWorth(decimal i, int n)
    {
        decimal v = 1m / (1m + i);
        decimal power = 1m;
        decimal sum = 0m;
        for (int k = 1; k <= n; k++)
        {
            power *= v;
            sum += (k - 1) * power;
        }
        return (double)sum;
    }

    /// <summary>Σ_{k=1..n} (1 + g)^(k−1) (1 + i)^−k.</summary>
    public static double GeometricGradientPresentWorth(decimal i, decimal g, int n)
    {
        decimal v = 1m / (1m + i);
        decimal discount = 1m;
        decimal growth = 1m;
        decimal sum = 0m;
        for (int k = 1; k <= n; k++)
        {
            discount *= v;
            sum += growth * discount;
            growth *= 1m + g;
        }
        return (double)sum;
    }

    /// <summary>(1 + i)^n − 1 by repeated multiplication.</summary>
    public static double CompoundAmountMinusOne(decimal i, int n)
    {
        decimal power = 1m;
        for (int k = 0; k < n; k++)
        {
            power *= 1m + i;
        }
        return (double)(power - 1m);
    }
}
