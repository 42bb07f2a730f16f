namespace CapReview.Engine.Taxes;

/// <summary>One year of the after-tax cash-flow table.</summary>
/// <param name="Period">The year (0: now).</param>
/// <param name="BeforeTax">The before-tax net flow.</param>
/// <param name="Depreciation">The depreciation deducted in the year.</param>
/// <param name="TaxableIncome">Operating gains less depreciation, plus a gain (or less a loss) over book value at disposal.</param>
/// <param name="LossUsed">Earlier losses carried forward and used this year.</param>
/// <param name="Tax">The tax of the year (negative: a saving against other income).</param>
/// <param name="Credit">Tax credits of the year.</param>
/// <param name="AfterTax">Before-tax flow less tax plus credits.</param>
/// <param name="Equity">The owners' flow with the loan: after-tax flow plus the loan's proceeds, less its payments, plus the tax saved on its interest.</param>
public sealed record AfterTaxRow(int Period, double BeforeTax, double Depreciation, double TaxableIncome, double LossUsed, double Tax, double Credit, double AfterTax, double Equity);

/// <summary>The after-tax table and the disposal's figures.</summary>
/// <param name="Rows">One row per year, 0 to the horizon.</param>
/// <param name="BookValueAtDisposal">Book value when the asset, with its later capital outlays, is sold at the horizon.</param>
/// <param name="GainOnDisposal">Proceeds less book value (negative: a loss).</param>
/// <param name="LossCarriedOut">Losses still unused at the end (carry-forward only).</param>
public sealed record AfterTaxResult(IReadOnlyList<AfterTaxRow> Rows, double BookValueAtDisposal, double GainOnDisposal, double LossCarriedOut)
{
    public IReadOnlyList<double> AfterTaxFlows => [.. Rows.Select(r => r.AfterTax)];

    public IReadOnlyList<double> EquityFlows => [.. Rows.Select(r => r.Equity)];
}
