using CapReview.Engine.Numerics;

namespace CapReview.Engine.Factors;

/// <summary>
/// Compound-interest factors under continuous compounding at a nominal rate <c>r</c> per period, <c>n</c> periods.
/// End-of-period payments give the discrete factors at i = e^r − 1; a uniform flow spread evenly over each period
/// (the "funds-flow" forms, marked Ā) gives (P/Ā) and (F/Ā). Limits at r = 0 are n. Common practice, no source.
/// </summary>
public static class ContinuousCompounding
{
    /// <summary>(F/P, r, n) = e^(rn).</summary>
    public static double SinglePaymentCompoundAmount(double r, int n) => Math.Exp(CheckRate(r) * n);

    /// <summary>(P/F, r, n) = e^(−rn).</summary>
    public static double SinglePaymentPresentWorth(double r, int n) => Math.Exp(-CheckRate(r) * n);

    /// <summary>(F/A, r, n) = (e^(rn) − 1)/(e^r − 1), end-of-period payments.</summary>
    public static double UniformSeriesCompoundAmount(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 0);
        return CheckRate(r) == 0.0 ? n : StableMath.Expm1(r * n) / StableMath.Expm1(r);
    }

    /// <summary>(P/A, r, n) = (1 − e^(−rn))/(e^r − 1), end-of-period payments.</summary>
    public static double UniformSeriesPresentWorth(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 0);
        return CheckRate(r) == 0.0 ? n : -StableMath.Expm1(-r * n) / StableMath.Expm1(r);
    }

    /// <summary>(A/F, r, n) = (e^r − 1)/(e^(rn) − 1).</summary>
    public static double SinkingFund(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 1);
        return 1.0 / UniformSeriesCompoundAmount(r, n);
    }

    /// <summary>(A/P, r, n) = (e^r − 1)/(1 − e^(−rn)).</summary>
    public static double CapitalRecovery(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 1);
        return 1.0 / UniformSeriesPresentWorth(r, n);
    }

    /// <summary>(P/Ā, r, n) = (1 − e^(−rn))/r: present worth of one unit per period flowing evenly.</summary>
    public static double UniformFlowPresentWorth(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 0);
        return CheckRate(r) == 0.0 ? n : -StableMath.Expm1(-r * n) / r;
    }

    /// <summary>(F/Ā, r, n) = (e^(rn) − 1)/r: future worth of one unit per period flowing evenly.</summary>
    public static double UniformFlowCompoundAmount(double r, int n)
    {
        CompoundInterest.CheckPeriods(n, 0);
        return CheckRate(r) == 0.0 ? n : StableMath.Expm1(r * n) / r;
    }

    private static double CheckRate(double r)
    {
        if (!double.IsFinite(r))
        {
            throw new ArgumentOutOfRangeException(nameof(r), r, "The nominal continuous rate must be finite.");
        }
        return r;
    }
}
