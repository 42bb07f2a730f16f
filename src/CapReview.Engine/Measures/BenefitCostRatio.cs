using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Measures;

/// <summary>
/// Benefit-cost ratios from the present worth of each category at the MARR. Benefits B are the revenue and savings
/// elements; operating costs O include taxes; capital costs I are net of the salvage S.
/// Conventional: B / (I − S + O). Modified: (B − O) / (I − S). A ratio with a denominator that is not positive is
/// undefined, and so is one no double can hold. ASTM E964, "Standard Practice for Measuring Benefit-to-Cost and
/// Savings-to-Investment Ratios for Buildings and Building Systems" (the modified form is its savings-to-investment ratio).
/// </summary>
public sealed record BenefitCostRatio(double Benefits, double OperatingCosts, double CapitalCosts, double Salvage, double? Conventional, double? Modified)
{
    /// <summary>I − S + O.</summary>
    public double ConventionalDenominator => CapitalCosts - Salvage + OperatingCosts;

    /// <summary>I − S.</summary>
    public double ModifiedDenominator => CapitalCosts - Salvage;

    public static BenefitCostRatio Compute(CashFlowModel model, double ratePerPeriod)
    {
        ArgumentNullException.ThrowIfNull(model);
        double benefits = Worth(model, ratePerPeriod, CashFlowCategory.Revenue);
        double operating = -Worth(model, ratePerPeriod, CashFlowCategory.Operating) - Worth(model, ratePerPeriod, CashFlowCategory.Tax);
        double capital = -Worth(model, ratePerPeriod, CashFlowCategory.Capital);
        double salvage = Worth(model, ratePerPeriod, CashFlowCategory.Salvage);
        double conventionalDenominator = capital - salvage + operating;
        double modifiedDenominator = capital - salvage;
        return new BenefitCostRatio(
            benefits,
            operating,
            capital,
            salvage,
            conventionalDenominator > 0.0 ? Finite(benefits / conventionalDenominator) : null,
            modifiedDenominator > 0.0 ? Finite((benefits - operating) / modifiedDenominator) : null);
    }

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
