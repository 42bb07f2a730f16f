using CapReview.Engine.Depreciation;

namespace CapReview.Engine.Taxes;

/// <summary>What happens to a year's tax loss.</summary>
public enum LossTreatment
{
    /// <summary>The loss offsets the organisation's other taxable income in the same year: a tax saving then (the default).</summary>
    Offset,

    /// <summary>The loss is carried forward and offsets the project's own later taxable income.</summary>
    CarryForward,
}

/// <summary>A tax credit: an amount that reduces the tax of one year (e.g. an investment or energy credit).</summary>
public sealed record TaxCredit(int Year, double Amount);

/// <summary>A loan for part of the first cost, repaid in equal yearly instalments.</summary>
/// <param name="Share">The share of the first cost borrowed (0–1).</param>
/// <param name="Rate">The loan's yearly interest rate.</param>
/// <param name="Term">Years to repay.</param>
public sealed record Loan(double Share, double Rate, int Term);

/// <summary>
/// The after-tax settings of a yearly model: the income-tax rate, the rate on a gain at disposal (the ordinary rate
/// unless set), the depreciation schedule of the first cost, credits, what a loss does, and optional financing.
/// </summary>
/// <param name="IncomeTaxRate">The effective (or combined) rate on taxable income.</param>
/// <param name="Depreciation">The depreciation of the depreciable basis by tax year, year 1 ending at period 1.</param>
/// <param name="DisposalYearShare">The share of the disposal year's depreciation allowed (1 for book methods; see <see cref="Macrs.DisposalYearShare"/>).</param>
/// <param name="GainTaxRate">The rate on the part of a gain at disposal above the original basis (the depreciation recaptured is ordinary income, <see cref="DisposalGain"/>); null for the income-tax rate.</param>
/// <param name="Losses">What a year's tax loss does.</param>
/// <param name="Credits">Tax credits by year.</param>
/// <param name="Financing">A loan for part of the first cost, or null.</param>
/// <param name="Outlays">How capital outlays after year 0 are depreciated; null deducts each in its year.</param>
public sealed record TaxSettings(
    double IncomeTaxRate,
    DepreciationSchedule Depreciation,
    double DisposalYearShare = 1.0,
    double? GainTaxRate = null,
    LossTreatment Losses = LossTreatment.Offset,
    IReadOnlyList<TaxCredit>? Credits = null,
    Loan? Financing = null,
    OutlayDepreciation? Outlays = null);

/// <summary>Rates of income tax.</summary>
public static class TaxRates
{
    /// <summary>
    /// A state rate s and a federal rate f where the state tax is deductible from federal taxable income:
    /// s + f (1 − s) (common practice, no source).
    /// </summary>
    public static double Combined(double federal, double state)
    {
        if (federal is < 0 or >= 1 || state is < 0 or >= 1 || !double.IsFinite(federal) || !double.IsFinite(state))
        {
            throw new ArgumentOutOfRangeException(nameof(federal), "Tax rates are from 0 to below 100 %.");
        }
        return state + federal * (1 - state);
    }
}
