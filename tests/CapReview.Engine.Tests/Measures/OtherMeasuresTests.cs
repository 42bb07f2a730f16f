using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Measures;

public class ExternalRateOfReturnTests
{
    [Theory]
    [InlineData(0.08, 0.08)]
    [InlineData(0.06, 0.12)]
    [InlineData(0.10, 0.03)]
    public void Matches_VisualBasic_MIRR(double finance, double reinvestment)
    {
        // Outside reference: Microsoft.VisualBasic.Financial.MIRR.
        double[] flows = [-5000, 1200, -800, 2500, 2600, 1800, -300, 2100];
        double[] copy = [.. flows];
        Close.Assert(Financial.MIRR(ref copy, finance, reinvestment), ExternalRateOfReturn.Compute(flows, finance, reinvestment)!.Value, 1e-12);
    }

    [Fact]
    public void Is_undefined_without_receipts_or_without_disbursements()
    {
        Assert.Null(ExternalRateOfReturn.Compute([-5, -5, -5], 0.1, 0.1));
        Assert.Null(ExternalRateOfReturn.Compute([5, 5], 0.1, 0.1));
        Assert.Null(ExternalRateOfReturn.Compute([-5], 0.1, 0.1));
    }
}

public class PaybackTests
{
    // Interpolated payback: common practice, no source (ASTM E1121 defines the measure).
    [Fact]
    public void Simple_payback_interpolates_within_the_period() =>
        Assert.Equal(2.8, Payback.Simple([-100, 30, 30, 50])!.Value, 12);

    [Fact]
    public void Discounted_payback_is_later_than_simple()
    {
        double[] flows = [-100, 40, 40, 40, 40];
        // Discounted at 10%: cumulative −63.64, −30.58, −0.53 after periods 1 to 3; period 4 brings 27.32.
        double expected = 3 + (100 - 40 / 1.1 - 40 / 1.21 - 40 / 1.331) / (40 / 1.4641);
        Assert.Equal(expected, Payback.Discounted(flows, 0.10)!.Value, 12);
        Assert.Equal(2.5, Payback.Simple(flows)!.Value, 12);
    }

    [Fact]
    public void Never_recovered_is_null()
    {
        Assert.Null(Payback.Simple([-100, 30, 30]));
        Assert.Null(Payback.Discounted([-100, 50, 50], 0.10));
    }

    [Fact]
    public void Recovered_exactly_at_a_period_end() => Assert.Equal(2.0, Payback.Simple([-100, 50, 50, 10])!.Value, 12);

    [Fact]
    public void Nothing_to_recover_is_zero() => Assert.Equal(0.0, Payback.Simple([0, 10, 10])!.Value);

    // Issue 17: a model with no flow at all (the empty model of a new proposal) has no payback, not "0.00 years".
    // Common practice, no source: payback is the time to recover an investment, and there is none.
    [Fact]
    public void No_flow_at_all_has_no_payback()
    {
        Assert.Null(Payback.Simple([0, 0, 0]));
        Assert.Null(Payback.Discounted([0, 0, 0], 0.10));
    }

    [Fact]
    public void A_later_investment_starts_the_clock_when_it_is_made() =>
        Assert.Equal(3.5, Payback.Simple([0, -100, 40, 40, 40])!.Value, 12);
}

public class BenefitCostRatioTests
{
    [Fact]
    public void Conventional_and_modified_ratios_at_zero_rate()
    {
        // At i = 0 every worth is the plain sum: B = 500, O = 100 + 20 tax, I = 300, S = 40.
        var model = Models.Valid(5, 1,
            new SingleAmount("Plant", Capital, 0, -300),
            new UniformSeries("Savings", Revenue, 1, 5, 100),
            new UniformSeries("Upkeep", Operating, 1, 5, -20),
            new SingleAmount("Tax", Tax, 5, -20),
            new SingleAmount("Resale", Salvage, 5, 40));
        var ratio = BenefitCostRatio.Compute(model, 0.0);
        Assert.Equal(500.0 / (300 - 40 + 120), ratio.Conventional!.Value, 12);
        Assert.Equal((500.0 - 120) / (300 - 40), ratio.Modified!.Value, 12);
    }

    [Fact]
    public void Ratios_discount_each_category_at_the_rate()
    {
        var model = Models.Valid(10, 1,
            new SingleAmount("Plant", Capital, 0, -1000),
            new UniformSeries("Savings", Revenue, 1, 10, 250),
            new UniformSeries("Upkeep", Operating, 1, 10, -50));
        double pa = -Financial.PV(0.08, 10, 1.0);
        var ratio = BenefitCostRatio.Compute(model, 0.08);
        Assert.Equal(250 * pa / (1000 + 50 * pa), ratio.Conventional!.Value, 10);
        Assert.Equal((250 * pa - 50 * pa) / 1000, ratio.Modified!.Value, 10);
    }

    [Fact]
    public void A_model_without_costs_has_no_ratio()
    {
        var ratio = BenefitCostRatio.Compute(Models.Valid(3, 1, new UniformSeries("Savings", Revenue, 1, 3, 10)), 0.05);
        Assert.Null(ratio.Conventional);
        Assert.Null(ratio.Modified);
    }
}

public class PresentWorthProfileTests
{
    [Fact]
    public void Profile_points_are_present_worths_at_annual_rates()
    {
        double[] flows = [-1000, 300, 300, 300, 300, 300];
        var profile = PresentWorthProfile.Compute(flows, 1, 0.0, 0.30, 4);
        Assert.Equal([0.0, 0.1, 0.2, 0.3], profile.Select(p => Math.Round(p.AnnualRate, 12)));
        Assert.Equal(500.0, profile[0].PresentWorth, 10);
        double[] later = flows.Skip(1).ToArray();
        Close.Assert(-1000 + Financial.NPV(0.2, ref later), profile[2].PresentWorth, 1e-12);
    }
}
