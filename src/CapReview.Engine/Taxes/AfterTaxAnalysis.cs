using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;

namespace CapReview.Engine.Taxes;

/// <summary>
/// After-tax cash flows of a yearly model (common practice, no source; see docs/methods.md). The first cost at year 0 is
/// capitalised and recovered through the depreciation schedule, and so is each capital outlay after year 0 (an
/// overhaul or addition: <see cref="OutlayAssets"/>) unless marked as a repair; revenues, operating costs and repairs
/// are taxed or deducted in their year. At the horizon the salvage is compared with the book value of the first cost
/// and the outlays together: the gain up to the depreciation taken is recaptured as ordinary income, only the part
/// above the basis is taxed at the gain rate, and a loss is deducted at the income-tax rate (<see cref="DisposalGain"/>).
/// Tax = rate × taxable income, a negative tax being a saving against other income unless losses are carried forward,
/// when they offset the later years' taxable income, the disposal's gain included (<see cref="YearlyTax"/>); credits
/// reduce the year's tax.
/// With a loan, its proceeds, instalments and the tax saved on its interest give the equity flows.
/// </summary>
public static class AfterTaxAnalysis
{
    public static AfterTaxResult Compute(CashFlowModel model, TaxSettings settings)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(settings);
        if (model.PeriodsPerYear != 1)
        {
            throw new ArgumentException("The after-tax analysis works in tax years: give the model yearly periods.", nameof(model));
        }
        Check(settings);
        int n = model.Horizon;
        double rate = settings.IncomeTaxRate, gainRate = settings.GainTaxRate ?? rate;

        var capitalAtZero = 0.0;
        var ordinary = new double[n + 1];
        var salvage = new double[n + 1];
        for (int e = 0; e < model.Elements.Count; e++)
        {
            double[] flows = model.FlowsOf(e);
            CashFlowCategory category = model.Elements[e].Category;
            for (int t = 0; t <= n; t++)
            {
                if (category == CashFlowCategory.Capital && t == 0)
                {
                    capitalAtZero += flows[t];
                }
                else if (category == CashFlowCategory.Salvage)
                {
                    salvage[t] += flows[t];
                }
                else
                {
                    ordinary[t] += flows[t];
                }
            }
        }

        var outlays = OutlayAssets.Of(model, settings.Outlays);
        for (int t = 0; t <= n; t++)
        {
            ordinary[t] += outlays.Cost[t];
        }
        var schedule = settings.Depreciation.DisposedIn(n, settings.DisposalYearShare);
        double bookValue = schedule.BookValueAfter(n) + outlays.BookValueAtDisposal;
        double proceeds = salvage.Sum();
        // The gain enters the year's taxable income (recapture as ordinary income), where carried losses offset it.
        double depreciationTaken = schedule.Basis - schedule.BookValueAfter(n) + outlays.Depreciation.Sum();
        var gain = DisposalGain.Of(proceeds, bookValue, depreciationTaken);
        var loan = LoanSchedule(settings.Financing, -capitalAtZero, n);
        var rows = new List<AfterTaxRow>(n + 1);
        var taxes = new YearlyTax(rate, gainRate, settings.Losses);
        for (int t = 0; t <= n; t++)
        {
            double depreciation = (t >= 1 && t <= schedule.Amounts.Count ? schedule.Amounts[t - 1] : 0) + outlays.Depreciation[t];
            double taxable = ordinary[t] - depreciation + (t == n ? gain.Ordinary : 0);
            double atGainRate = t == n ? gain.AtGainRate : 0;
            var (tax, used) = taxes.Charge(taxable, atGainRate);
            double credit = (settings.Credits ?? []).Where(c => c.Year == t).Sum(c => c.Amount);
            double before = model.NetFlows[t];
            double after = before - tax + credit;
            // The interest saves tax at the income-tax rate (against other income, as a deduction of the year).
            double equity = after + loan.Proceeds[t] - loan.Payments[t] + rate * loan.Interest[t];
            rows.Add(new AfterTaxRow(t, before, depreciation, taxable + atGainRate, used, tax, credit, after, equity));
        }
        return new AfterTaxResult(rows, bookValue, gain.Total, taxes.Carried);
    }

    private static (double[] Proceeds, double[] Payments, double[] Interest) LoanSchedule(Loan? loan, double firstCost, int horizon)
    {
        var proceeds = new double[horizon + 1];
        var payments = new double[horizon + 1];
        var interest = new double[horizon + 1];
        if (loan is null || loan.Share == 0 || firstCost <= 0)
        {
            return (proceeds, payments, interest);
        }
        double principal = firstCost * loan.Share, balance = principal;
        double instalment = principal * CompoundInterest.CapitalRecovery(loan.Rate, loan.Term);
        proceeds[0] = principal;
        for (int t = 1; t <= Math.Min(loan.Term, horizon); t++)
        {
            interest[t] = balance * loan.Rate;
            // A loan longer than the horizon is repaid in full with the last instalment inside it.
            payments[t] = t == Math.Min(loan.Term, horizon) ? balance + interest[t] : instalment;
            balance -= payments[t] - interest[t];
        }
        return (proceeds, payments, interest);
    }

    private static void Check(TaxSettings s)
    {
        if (!(s.IncomeTaxRate >= 0 && s.IncomeTaxRate < 1) || s.GainTaxRate is < 0 or >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(s), "Tax rates are from 0 to below 100 %.");
        }
        if (!(s.DisposalYearShare >= 0 && s.DisposalYearShare <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(s), "The disposal year's share of depreciation is from 0 to 1.");
        }
        if (s.Financing is { } loan && (!(loan.Share >= 0 && loan.Share <= 1) || !(loan.Rate >= 0 && loan.Rate < 1) || loan.Term is < 1 or > 100))
        {
            throw new ArgumentOutOfRangeException(nameof(s), "A loan's share is 0 to 1, its rate 0 to below 100 %, its term 1 to 100 years.");
        }
    }
}
