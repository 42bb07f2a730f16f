using CapReview.Engine.CashFlows;
using CapReview.Engine.Numerics;

namespace CapReview.Engine.Inflation;

/// <summary>Whether an element's amounts are in money of their own dates or in constant money of a base year.</summary>
public enum MoneyBasis
{
    /// <summary>Then-current (actual) money: the amounts that will be paid or received.</summary>
    Actual,

    /// <summary>Constant (real) money of the base year: the amounts escalate with their price to become actual.</summary>
    Constant,
}

/// <summary>How one element's amounts are priced.</summary>
/// <param name="Basis">The money its amounts are given in.</param>
/// <param name="Escalation">Its own yearly price escalation (energy, wages); null for general inflation.</param>
public sealed record ElementPricing(MoneyBasis Basis, double? Escalation = null);

/// <summary>
/// Converts between constant and actual money (common practice, no source; see docs/methods.md). An element in
/// constant money of base year b escalating at e a year is worth A (1 + e)^(t − b) in actual money at time t (years);
/// actual money deflated by general inflation f, A / (1 + f)^(t − b), is real money. Actual flows at the market rate
/// and real flows at the real rate, (1 + i_m) = (1 + i_r)(1 + f), have the same present worth. Depreciation and tax
/// work on actual money.
/// </summary>
public static class PriceLevels
{
    /// <summary>The model's net flows in actual money; <paramref name="pricing"/> has one entry per element (missing: actual).</summary>
    public static double[] ActualFlows(CashFlowModel model, IReadOnlyList<ElementPricing?> pricing, double generalInflation, int baseYear = 0)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(pricing);
        Check(generalInflation);
        var actual = new double[model.Horizon + 1];
        for (int e = 0; e < model.Elements.Count; e++)
        {
            double[] flows = model.FlowsOf(e);
            ElementPricing? price = e < pricing.Count ? pricing[e] : null;
            double growth = price?.Basis == MoneyBasis.Constant ? price.Escalation ?? generalInflation : 0.0;
            Check(growth);
            for (int t = 0; t < flows.Length; t++)
            {
                actual[t] += flows[t] * Factor(growth, (double)t / model.PeriodsPerYear - baseYear);
            }
        }
        return actual;
    }

    /// <summary>Actual flows deflated by general inflation to constant money of the base year.</summary>
    public static double[] RealFlows(IReadOnlyList<double> actual, double generalInflation, int periodsPerYear, int baseYear = 0)
    {
        ArgumentNullException.ThrowIfNull(actual);
        Check(generalInflation);
        return [.. actual.Select((a, t) => a / Factor(generalInflation, (double)t / periodsPerYear - baseYear))];
    }

    /// <summary>(1 + rate)^years, through log1p so small rates keep their digits.</summary>
    private static double Factor(double rate, double years) => Math.Exp(years * StableMath.Log1p(rate));

    private static void Check(double rate)
    {
        if (!double.IsFinite(rate) || rate <= -1)
        {
            throw new ArgumentOutOfRangeException(nameof(rate), rate, "An inflation or escalation rate must be a number above −100 %.");
        }
    }
}
