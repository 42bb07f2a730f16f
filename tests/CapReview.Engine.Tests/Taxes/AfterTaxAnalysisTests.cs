using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Taxes;

public class AfterTaxAnalysisTests
{
    // An invented press: 100,000 now, saves 30,000 a year for five years, sold for a stated value at year 5.
    private static CashFlowModel Press(double resale) => Models.Valid(5, 1,
        new SingleAmount("Press", Capital, 0, -100_000),
        new UniformSeries("Labour saved", Revenue, 1, 5, 30_000),
        new SingleAmount("Resale", Salvage, 5, resale));

    private static TaxSettings StraightLine(double rate = 0.25) => new(rate, BookDepreciation.StraightLine(100_000, 10_000, 5));

    [Fact]
    public void The_after_tax_flows_and_rate_of_return_of_a_straight_line_asset_match_a_hand_computation()
    {
        // Hand computation: depreciation 18,000 a year; taxable 12,000; tax 3,000; after-tax 27,000 a year, plus the
        // resale of 10,000 at its book value (no gain) in year 5.
        var result = AfterTaxAnalysis.Compute(Press(10_000), StraightLine());
        double[] hand = [-100_000, 27_000, 27_000, 27_000, 27_000, 37_000];
        Assert.Equal(hand, result.AfterTaxFlows.Select(f => Math.Round(f, 6)));
        Assert.All(result.Rows.Skip(1), r => Assert.Equal(18_000, r.Depreciation, 9));
        Assert.Equal(3_000, result.Rows[1].Tax, 9);
        Assert.Equal(0, result.GainOnDisposal, 9);
        // Outside reference: Microsoft.VisualBasic.Financial.IRR of the hand-computed flows.
        double[] flows = [.. hand];
        double irr = Financial.IRR(ref flows);
        var roots = Engine.Measures.RateOfReturnSearch.Find([.. result.AfterTaxFlows], -0.99, 10);
        Assert.Equal(irr, roots.UniqueRoot!.Value, 9);
    }

    [Fact]
    public void A_gain_over_book_value_is_taxed_and_a_loss_saves_tax()
    {
        // Hand computation: sold for 25,000 against a book value of 10,000: a 15,000 gain, 3,750 tax at 25 %.
        var gain = AfterTaxAnalysis.Compute(Press(25_000), StraightLine());
        Assert.Equal(15_000, gain.GainOnDisposal, 9);
        Assert.Equal(3_000 + 3_750, gain.Rows[5].Tax, 9);
        Assert.Equal(30_000 + 25_000 - 6_750, gain.Rows[5].AfterTax, 9);
        // With a gain rate of 15 % the same gain is still all recaptured depreciation (15,000 of the 90,000 taken), taxed
        // as ordinary income at 25 % (IRC §1245 as IRS Publication 544 summarises it; from memory).
        Assert.Equal(3_000 + 3_750, AfterTaxAnalysis.Compute(Press(25_000), StraightLine() with { GainTaxRate = 0.15 }).Rows[5].Tax, 9);
        // Sold for 4,000: a 6,000 loss deducted at 25 %, a saving of 1,500.
        var loss = AfterTaxAnalysis.Compute(Press(4_000), StraightLine());
        Assert.Equal(-6_000, loss.GainOnDisposal, 9);
        Assert.Equal(3_000 - 1_500, loss.Rows[5].Tax, 9);
    }

    [Fact]
    public void A_tax_credit_reduces_the_tax_of_its_year()
    {
        var result = AfterTaxAnalysis.Compute(Press(10_000), StraightLine() with { Credits = [new TaxCredit(1, 10_000)] });
        Assert.Equal(37_000, result.Rows[1].AfterTax, 9);
        Assert.Equal(27_000, result.Rows[2].AfterTax, 9);
    }

    [Fact]
    public void A_loss_is_a_saving_when_offset_and_waits_for_later_income_when_carried_forward()
    {
        // Hand computation: written off in year 1, taxable −70,000, then +30,000 a year.
        var settings = new TaxSettings(0.25, BookDepreciation.StraightLine(100_000, 0, 1));
        var offset = AfterTaxAnalysis.Compute(Press(0), settings);
        Assert.Equal(-17_500, offset.Rows[1].Tax, 9);
        Assert.Equal(7_500, offset.Rows[2].Tax, 9);

        var carried = AfterTaxAnalysis.Compute(Press(0), settings with { Losses = LossTreatment.CarryForward });
        Assert.Equal([0, 0, 0, 0, 0.25 * 20_000, 7_500], carried.Rows.Select(r => Math.Round(r.Tax, 6)));
        Assert.Equal([0, 0, 30_000, 30_000, 10_000, 0], carried.Rows.Select(r => Math.Round(r.LossUsed, 6)));
        Assert.Equal(0, carried.LossCarriedOut, 9);
        // Both pay the same tax in total; carrying forward pays it later.
        Assert.Equal(offset.Rows.Sum(r => r.Tax), carried.Rows.Sum(r => r.Tax), 9);
    }

    [Fact]
    public void The_combined_rate_deducts_the_state_tax_from_federal_income() =>
        // Common practice, no source: 6 % + 21 % × 94 %.
        Assert.Equal(0.2574, TaxRates.Combined(0.21, 0.06), 12);

    [Fact]
    public void The_equity_flows_carry_the_loan_its_instalments_and_the_tax_saved_on_interest()
    {
        var result = AfterTaxAnalysis.Compute(Press(10_000), StraightLine() with { Financing = new Loan(0.6, 0.06, 5) });
        Assert.Equal(-40_000, result.Rows[0].Equity, 9);
        // Outside reference: Microsoft.VisualBasic.Financial.Pmt and IPmt for the instalment and its interest.
        double instalment = -Financial.Pmt(0.06, 5, 60_000);
        for (int t = 1; t <= 5; t++)
        {
            double interest = -Financial.IPmt(0.06, t, 5, 60_000);
            Assert.Equal(result.Rows[t].AfterTax - instalment + 0.25 * interest, result.Rows[t].Equity, 6);
        }
    }

    [Fact]
    public void MACRS_property_sold_before_the_end_of_its_recovery_takes_half_a_year_and_is_compared_with_its_book_value()
    {
        // 5-year property, half-year convention, sold at year 3: 20 % + 32 % + half of 19.2 % (IRS Publication 946).
        var schedule = Macrs.Schedule(100_000, MacrsClass.FiveYear, MacrsConvention.HalfYear);
        var model = Models.Valid(3, 1, new SingleAmount("Press", Capital, 0, -100_000), new UniformSeries("Saved", Revenue, 1, 3, 30_000), new SingleAmount("Resale", Salvage, 3, 50_000));
        var result = AfterTaxAnalysis.Compute(model, new TaxSettings(0.25, schedule, Macrs.DisposalYearShare(MacrsConvention.HalfYear, 0)));
        Assert.Equal([0, 20_000, 32_000, 9_600], result.Rows.Select(r => Math.Round(r.Depreciation, 6)));
        Assert.Equal(38_400, result.BookValueAtDisposal, 6);
        Assert.Equal(11_600, result.GainOnDisposal, 6);
    }

    [Fact]
    public void Only_yearly_models_are_taxed() =>
        Assert.Throws<ArgumentException>(() => AfterTaxAnalysis.Compute(Models.Valid(12, 12, new SingleAmount("a", Capital, 0, -1)), StraightLine()));
}
