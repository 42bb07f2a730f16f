using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;
using CapReview.Engine.Tests.Support;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Taxes;

/// <summary>
/// The gain at disposal inside the year's taxable income: the depreciation taken back is recaptured as ordinary income
/// and only proceeds above the original basis are taxed at the gain rate (IRC §1245 recapture as IRS Publication 544,
/// "Depreciation Recapture", summarises it; from memory); carried losses offset the whole of it. Every expected value
/// is a hand computation written out beside it.
/// </summary>
public class DisposalGainTests
{
    // An invented mould: 100,000 now, written off in year 1, saving 15,000 a year for five years, resold at year 5.
    private static CashFlowModel Mould(double resale) => Models.Valid(5, 1,
        new SingleAmount("Mould", Capital, 0, -100_000),
        new UniformSeries("Labour saved", Revenue, 1, 5, 15_000),
        new SingleAmount("Resale", Salvage, 5, resale));

    private static TaxSettings WrittenOffInYearOne(LossTreatment losses, double? gainRate = null) =>
        new(0.25, BookDepreciation.StraightLine(100_000, 0, 1), GainTaxRate: gainRate, Losses: losses);

    [Fact]
    public void Carried_losses_offset_the_gain_so_a_life_that_sums_to_zero_pays_no_tax_and_leaves_no_loss()
    {
        // Hand computation: taxable income −85,000 in year 1, 15,000 in years 2-4, and 15,000 + a 25,000 gain (book value
        // 0) in year 5: 0 over the life. Carried: 85,000, used 15,000 a year, and the last 40,000 against year 5's
        // 15,000 + 25,000, so no tax in any year and nothing carried out.
        var carried = AfterTaxAnalysis.Compute(Mould(25_000), WrittenOffInYearOne(LossTreatment.CarryForward));
        Assert.Equal(25_000, carried.GainOnDisposal, 9);
        Assert.Equal([0, 0, 0, 0, 0, 0], carried.Rows.Select(r => Math.Round(r.Tax, 6)));
        Assert.Equal([0, 0, 15_000, 15_000, 15_000, 40_000], carried.Rows.Select(r => Math.Round(r.LossUsed, 6)));
        Assert.Equal(40_000, carried.Rows[5].TaxableIncome, 9);
        Assert.Equal(0, carried.LossCarriedOut, 9);
        Assert.Equal(15_000 + 25_000, carried.Rows[5].AfterTax, 9);

        // Offset against other income the same life pays the same total tax, 25 % of zero, spread over the years.
        var offset = AfterTaxAnalysis.Compute(Mould(25_000), WrittenOffInYearOne(LossTreatment.Offset));
        Assert.Equal(0, offset.Rows.Sum(r => r.Tax), 9);
        Assert.Equal(0.25 * 40_000, offset.Rows[5].Tax, 9);
    }

    [Fact]
    public void Proceeds_above_the_basis_are_taxed_at_the_gain_rate_after_carried_losses_take_the_ordinary_income()
    {
        // Hand computation: resold for 110,000 against a book value of 0 and a basis of 100,000: 100,000 recaptured
        // (ordinary) and 10,000 at the 15 % gain rate. Year 5: ordinary 15,000 + 100,000 = 115,000, less the 40,000
        // still carried, at 25 % = 18,750; the 10,000 at 15 % = 1,500. Carried losses come off ordinary income first
        // (IRC §1(h) taxes at the lower rate the smaller of the gain and taxable income; from memory).
        var carried = AfterTaxAnalysis.Compute(Mould(110_000), WrittenOffInYearOne(LossTreatment.CarryForward, 0.15));
        Assert.Equal(110_000, carried.GainOnDisposal, 9);
        Assert.Equal(18_750 + 1_500, carried.Rows[5].Tax, 9);
        Assert.Equal(40_000, carried.Rows[5].LossUsed, 9);
        Assert.Equal(0, carried.LossCarriedOut, 9);

        // Offset: 25 % of 115,000 in year 5 and 15 % of 10,000.
        var offset = AfterTaxAnalysis.Compute(Mould(110_000), WrittenOffInYearOne(LossTreatment.Offset, 0.15));
        Assert.Equal(0.25 * 115_000 + 0.15 * 10_000, offset.Rows[5].Tax, 9);
    }

    [Fact]
    public void A_gain_smaller_than_the_carried_losses_uses_only_its_own_amount()
    {
        // Hand computation: no savings at all, written off in year 1 (taxable −100,000, all carried), resold at year 5
        // for 30,000: a gain of 30,000 that uses 30,000 of the loss; 70,000 carried out, no tax paid.
        var model = Models.Valid(5, 1, new SingleAmount("Mould", Capital, 0, -100_000), new SingleAmount("Resale", Salvage, 5, 30_000));
        var result = AfterTaxAnalysis.Compute(model, WrittenOffInYearOne(LossTreatment.CarryForward));
        Assert.Equal([0, 0, 0, 0, 0, 0], result.Rows.Select(r => Math.Round(r.Tax, 6)));
        Assert.Equal(30_000, result.Rows[5].LossUsed, 9);
        Assert.Equal(70_000, result.LossCarriedOut, 9);
    }

    [Fact]
    public void A_years_own_loss_nets_against_its_gain_before_carried_losses_are_used()
    {
        // Hand computation at 25 % and a 15 % gain rate. Year 1: a 50,000 loss, carried. Year 2: an ordinary loss of
        // 10,000 against 30,000 at the gain rate nets to 20,000 of gain, which 20,000 of the carried loss offsets (30,000
        // left). Year 3: 40,000 ordinary and 10,000 at the gain rate; the 30,000 comes off the ordinary income, leaving
        // 25 % of 10,000 and 15 % of 10,000 = 4,000.
        var taxes = new YearlyTax(0.25, 0.15, LossTreatment.CarryForward);
        Assert.Equal((0.0, 0.0), taxes.Charge(-50_000, 0));
        Assert.Equal((0.0, 20_000.0), taxes.Charge(-10_000, 30_000));
        Assert.Equal(30_000, taxes.Carried, 9);
        var (tax, used) = taxes.Charge(40_000, 10_000);
        Assert.Equal(4_000, tax, 9);
        Assert.Equal(30_000, used, 9);
        Assert.Equal(0, taxes.Carried, 9);
    }

    [Fact]
    public void The_gain_splits_into_recapture_up_to_the_depreciation_taken_and_the_excess_over_the_basis()
    {
        // Hand computation: basis 100,000, 60,000 taken, book value 40,000.
        Assert.Equal(new DisposalGain(20_000, 0), DisposalGain.Of(60_000, 40_000, 60_000));
        Assert.Equal(new DisposalGain(60_000, 15_000), DisposalGain.Of(115_000, 40_000, 60_000));
        Assert.Equal(new DisposalGain(-10_000, 0), DisposalGain.Of(30_000, 40_000, 60_000));
        Assert.Equal(75_000, DisposalGain.Of(115_000, 40_000, 60_000).Total);
    }
}
