using CapReview.Engine.CashFlows;
using CapReview.Engine.Inflation;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using CsCheck;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Inflation;

public class PriceLevelTests
{
    [Fact]
    public void Real_flows_at_the_real_rate_and_actual_flows_at_the_market_rate_have_the_same_present_worth() =>
        // Common practice, no source: (1 + i_m) = (1 + i_r)(1 + f) makes the two discountings the same.
        Gen.Select(Gen.Double[-0.02, 0.15], Gen.Double[0.0, 0.15], Gen.Double[-0.05, 0.20], Gen.Int[1, 40]).Sample((inflation, real, escalation, years) =>
        {
            var model = Models.Valid(years, 1,
                new SingleAmount("Plant", Capital, 0, -500_000),
                new UniformSeries("Energy saved", Revenue, 1, years, 60_000),
                new UniformSeries("Upkeep", Operating, 1, years, -8_000));
            double[] actual = PriceLevels.ActualFlows(model, [null, new(MoneyBasis.Constant, escalation), new(MoneyBasis.Constant)], inflation);
            double[] realFlows = PriceLevels.RealFlows(actual, inflation, 1);
            double market = InflationAdjustment.MarketRate(real, inflation);
            double pwActual = FlowWorth.PresentWorth(actual, market), pwReal = FlowWorth.PresentWorth(realFlows, real);
            return Math.Abs(pwActual - pwReal) <= 1e-9 * (500_000 + 60_000 * years);
        });

    [Fact]
    public void A_constant_money_series_escalating_at_its_own_rate_is_a_geometric_series_in_actual_money()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.NPV of 60,000 × 1.04^t for t = 1 … 10 at 10 %.
        var model = Models.Valid(10, 1, new UniformSeries("Energy saved", Revenue, 1, 10, 60_000));
        double[] actual = PriceLevels.ActualFlows(model, [new(MoneyBasis.Constant, 0.04)], generalInflation: 0.02);
        double[] expected = [.. Enumerable.Range(1, 10).Select(t => 60_000 * Math.Pow(1.04, t))];
        Assert.Equal(0, actual[0]);
        Close.Assert(Financial.NPV(0.10, ref expected), FlowWorth.PresentWorth(actual, 0.10), 1e-12);
    }

    [Fact]
    public void Actual_money_is_left_as_it_is_and_the_base_year_moves_the_price_level()
    {
        var model = Models.Valid(2, 1, new UniformSeries("Wages", Operating, 1, 2, -1_000));
        Assert.Equal([0, -1_000, -1_000], PriceLevels.ActualFlows(model, [new(MoneyBasis.Actual, 0.5)], 0.03));
        // In money of year 1, the amount of year 1 needs no escalation and year 2's one year of it.
        var shifted = PriceLevels.ActualFlows(model, [new(MoneyBasis.Constant, 0.05)], 0.03, baseYear: 1);
        Assert.Equal(-1_000, shifted[1], 9);
        Assert.Equal(-1_050, shifted[2], 9);
    }
}
