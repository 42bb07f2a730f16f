using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using MathNet.Numerics.RootFinding;

namespace CapReview.Engine.Comparison;

/// <summary>
/// How the board's order changes with the MARR: each proposal's annual worth at another rate, and the annual rates at
/// which two proposals' annual worths are equal (where their order swaps). With equal lives these are the rates of
/// return of the difference of their flows (Fisher's intersection; common practice, no source).
/// </summary>
public static class MarrWhatIf
{
    /// <summary>Annual worth per year at an annual effective MARR.</summary>
    public static double AnnualWorthAt(CashFlowModel model, double annualEffectiveMarr)
    {
        ArgumentNullException.ThrowIfNull(model);
        int p = model.PeriodsPerYear;
        double i = AnnualRate.PeriodFromAnnualEffective(annualEffectiveMarr, p);
        double perPeriod = FlowWorth.PresentWorth([.. model.NetFlows], i) * CompoundInterest.CapitalRecovery(i, model.Horizon);
        return perPeriod * CompoundInterest.UniformSeriesCompoundAmount(i, p);
    }

    /// <summary>Every annual rate in [<paramref name="from"/>, <paramref name="to"/>] at which the two annual worths are equal.</summary>
    public static IReadOnlyList<double> SwapRates(CashFlowModel first, CashFlowModel second, double from, double to)
    {
        ArgumentNullException.ThrowIfNull(first);
        ArgumentNullException.ThrowIfNull(second);
        if (!(from > -1.0) || !(to > from) || to > RateOfReturnSearch.HighestAnnual)
        {
            throw new ArgumentOutOfRangeException(nameof(from), "The range must lie within (−100%, 1000%] and be non-empty.");
        }
        double Gap(double rate) => AnnualWorthAt(first, rate) - AnnualWorthAt(second, rate);

        const int steps = 400;
        var swaps = new List<double>();
        double previousRate = from, previousGap = Gap(from);
        for (int k = 1; k <= steps; k++)
        {
            double rate = from + (to - from) * k / steps;
            double gap = Gap(rate);
            if (gap == 0.0)
            {
                swaps.Add(rate);
            }
            else if (Math.Sign(gap) * Math.Sign(previousGap) < 0 && Brent.TryFindRoot(Gap, previousRate, rate, 1e-13, 200, out double root))
            {
                swaps.Add(root);
            }
            (previousRate, previousGap) = (rate, gap);
        }
        return swaps;
    }
}
