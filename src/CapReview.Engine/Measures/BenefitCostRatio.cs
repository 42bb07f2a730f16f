using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Measures;

/// <summary>
/// Benefit-cost ratios from the present worth of each category at the MARR. Benefits B are the revenue and savings
/// elements; operating costs O include taxes; capital costs I are net of the salvage S.
/// Conventional: B / (I − S + O). Modified: (B − O) / (I − S). A ratio with a denominator that is not positive is
/// undefined, and so is one no double can hold. A denominator within 1e-9 of the sum of its parts' magnitudes, the
/// accuracy the engine states for a closed-form worth, is zero: parts that cancel exactly (a deposit returned, a cost
/// entered in two shapes) leave a residue of rounding whose sign is chance, and dividing by it gives a meaningless ratio. ASTM E964, "Standard Practice for Measuring Benefit-to-Cost and
/// Savings-to-Investment Ratios for Buildings and Building Systems" (the modified form is its savings-to-investment ratio).
/// </summary>
public sealed record BenefitCostRatio(double Benefits, double OperatingCosts, double CapitalCosts, double Salvage, double? Conventional, double? Modified)
{
    // The engine's stated accuracy for a closed-form worth, relative to the gross worth (docs/methods.md).
    private const double Negligible = 1e-9;

    /// <summary>I − S + O, or 0 when it is zero to within the accuracy of its parts.</summary>
    public double ConventionalDenominator => Denominator(CapitalCosts - Salvage + OperatingCosts, Math.Abs(CapitalCosts) + Math.Abs(Salvage) + Math.Abs(OperatingCosts));

    /// <summary>I − S, or 0 when it is zero to within the accuracy of its parts.</summary>
    public double ModifiedDenominator => Denominator(CapitalCosts - Salvage, Math.Abs(CapitalCosts) + Math.Abs(Salvage));

    public static BenefitCostRatio Compute(CashFlowModel model, double ratePerPeriod)
    {
        ArgumentNullException.ThrowIfNull(model);
        double benefits = Worth(model, ratePerPeriod, CashFlowCategory.Revenue);
        double operating = -Worth(model, ratePerPeriod, CashFlowCategory.Operating) - Worth(model, ratePerPeriod, CashFlowCategory.Tax);
        double capital = -Worth(model, ratePerPeriod, CashFlowCategory.Capital);
        double salvage = Worth(model, ratePerPeriod, CashFlowCategory.Salvage);
        var parts = new BenefitCostRatio(benefits, operating, capital, salvage, null, null);
        double conventionalDenominator = parts.ConventionalDenominator;
        double modifiedDenominator = parts.ModifiedDenominator;
        return parts with
        {
            Conventional = conventionalDenominator > 0.0 ? Finite(benefits / conventionalDenominator) : null,
            Modified = modifiedDenominator > 0.0 ? Finite((benefits - operating) / modifiedDenominator) : null,
        };
    }

    private static double Denominator(double value, double gross) => Math.Abs(value) <= Negligible * gross ? 0.0 : value;

    /// <summary>
    /// The category's present worth from its elements' closed forms, or from its flows where a closed form overflows in a
    /// part whose product is finite (an escalated element's deflated rate near −100%).
    /// </summary>
    private static double Worth(CashFlowModel model, double i, CashFlowCategory category)
    {
        double closed = model.ClosedFormPresentWorth(i, category);
        if (double.IsFinite(closed))
        {
            return closed;
        }
        var flows = new double[model.Horizon + 1];
        for (int e = 0; e < model.Elements.Count; e++)
        {
            if (model.Elements[e].Category == category)
            {
                model.Elements[e].AddTo(flows);
            }
        }
        return FlowWorth.PresentWorth(flows, i);
    }

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
