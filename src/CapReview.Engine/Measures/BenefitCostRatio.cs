using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Measures;

/// <summary>
/// Benefit-cost ratios from the present worth of each category at the MARR. Benefits B are the revenue and savings
/// elements; operating costs O include taxes; capital costs I are net of the salvage S.
/// Conventional: B / (I − S + O). Modified: (B − O) / (I − S). A ratio with a denominator that is not positive is
/// undefined. ASTM E964, "Standard Practice for Measuring Benefit-to-Cost and Savings-to-Investment Ratios for
/// Buildings and Building Systems" (the modified form is its savings-to-investment ratio).
/// </summary>
public sealed record BenefitCostRatio(double Benefits, double OperatingCosts, double CapitalCosts, double Salvage, double? Conventional, double? Modified)
{
    public static BenefitCostRatio Compute(CashFlowModel model, double ratePerPeriod)
    {
        ArgumentNullException.ThrowIfNull(model);
        double benefits = model.ClosedFormPresentWorth(ratePerPeriod, CashFlowCategory.Revenue);
        double operating = -model.ClosedFormPresentWorth(ratePerPeriod, CashFlowCategory.Operating)
            - model.ClosedFormPresentWorth(ratePerPeriod, CashFlowCategory.Tax);
        double capital = -model.ClosedFormPresentWorth(ratePerPeriod, CashFlowCategory.Capital);
        double salvage = model.ClosedFormPresentWorth(ratePerPeriod, CashFlowCategory.Salvage);
        double conventionalDenominator = capital - salvage + operating;
        double modifiedDenominator = capital - salvage;
        return new BenefitCostRatio(
            benefits,
            operating,
            capital,
            salvage,
            conventionalDenominator > 0.0 ? benefits / conventionalDenominator : null,
            modifiedDenominator > 0.0 ? (benefits - operating) / modifiedDenominator : null);
    }
}
