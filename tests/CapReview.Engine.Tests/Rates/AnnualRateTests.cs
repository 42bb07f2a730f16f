using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using CsCheck;

namespace CapReview.Engine.Tests.Rates;

public class AnnualRateTests
{
    [Theory]
    [InlineData(0.12, 12, 0.126825030131970)]
    [InlineData(0.12, 4, 0.125508810000000)]
    [InlineData(0.06, 2, 0.0609)]
    [InlineData(0.10, 365, 0.105155781616264)]
    public void Nominal_rate_gives_the_effective_annual_rate(double nominal, int m, double expected)
    {
        // Common practice, no source: (1 + r/m)^m − 1, expected values by Math.Pow.
        Close.Relative(Math.Pow(1 + nominal / m, m) - 1, expected, 1e-12, "reference");
        Close.Relative(expected, AnnualRate.Nominal(nominal, m).EffectiveAnnual(), 1e-13);
    }

    [Fact]
    public void Continuous_rate_gives_e_to_the_r_minus_1() =>
        Close.Relative(Math.Exp(0.10) - 1, AnnualRate.Continuous(0.10).EffectiveAnnual(), 1e-15);

    [Theory]
    [InlineData(1, 0.12)]
    [InlineData(12, 0.009488792934583)]
    [InlineData(4, 0.028737344722080)]
    [InlineData(2, 0.058300524425836)]
    public void Effective_annual_rate_converts_to_the_payment_period(int periodsPerYear, double expected)
    {
        // Common practice, no source: (1 + i)^(1/p) − 1.
        Close.Relative(expected, AnnualRate.Effective(0.12).EffectivePerPeriod(periodsPerYear), 1e-11);
    }

    [Fact]
    public void Nominal_monthly_compounding_gives_the_quarterly_payment_rate()
    {
        // 12% compounded monthly, paid quarterly: (1.01)^3 − 1 = 3.0301%.
        Close.Relative(0.030301, AnnualRate.Nominal(0.12, 12).EffectivePerPeriod(4), 1e-13);
    }

    [Fact]
    public void Continuous_rate_converts_to_a_monthly_payment_rate() =>
        Close.Relative(Math.Exp(0.09 / 12) - 1, AnnualRate.Continuous(0.09).EffectivePerPeriod(12), 1e-14);

    [Fact]
    public void Converting_to_another_basis_keeps_the_effective_rate()
    {
        AnnualRate nominal = AnnualRate.Effective(0.08).ToBasis(RateBasis.Nominal, 12);
        Close.Relative(12 * (Math.Pow(1.08, 1.0 / 12) - 1), nominal.Value, 1e-13);
        Close.Relative(0.08, nominal.EffectiveAnnual(), 1e-14);
        Close.Relative(Math.Log(1.08), AnnualRate.Effective(0.08).ToBasis(RateBasis.Continuous).Value, 1e-15);
    }

    [Fact]
    public void Period_rate_and_back_is_the_identity() =>
        Gen.Select(Gen.Double[-0.9, 5.0], Gen.OneOf(Gen.Const(1), Gen.Const(2), Gen.Const(4), Gen.Const(12), Gen.Const(52), Gen.Int[1, 365]))
            .Sample((annual, p) =>
            {
                double perPeriod = AnnualRate.Effective(annual).EffectivePerPeriod(p);
                double back = AnnualRate.FromEffectivePerPeriod(perPeriod, p).EffectiveAnnual();
                return Math.Abs(back - annual) <= 1e-13 * Math.Max(1.0, Math.Abs(annual));
            });

    [Fact]
    public void Basis_conversion_and_back_is_the_identity() =>
        Gen.Select(Gen.Double[-0.5, 2.0], Gen.Int[1, 365]).Sample((rate, m) =>
        {
            AnnualRate nominal = AnnualRate.Nominal(rate, m);
            double back = nominal.ToBasis(RateBasis.Continuous).ToBasis(RateBasis.Nominal, m).Value;
            return Math.Abs(back - rate) <= 1e-12 * Math.Max(1.0, Math.Abs(rate));
        });

    [Theory]
    [InlineData(double.NaN, RateBasis.Effective, 1, "rate.value")]
    [InlineData(double.PositiveInfinity, RateBasis.Effective, 1, "rate.value")]
    [InlineData(-1.0, RateBasis.Effective, 1, "rate.value")]
    [InlineData(-2.5, RateBasis.Effective, 1, "rate.value")]
    [InlineData(0.10, RateBasis.Nominal, 0, "rate.compoundingsPerYear")]
    [InlineData(0.10, RateBasis.Nominal, 9000, "rate.compoundingsPerYear")]
    [InlineData(-12.0, RateBasis.Nominal, 12, "rate.value")]
    [InlineData(11.0, RateBasis.Effective, 1, "rate.value")]
    [InlineData(3.0, RateBasis.Continuous, 0, "rate.value")]
    [InlineData(0.10, (RateBasis)7, 1, "rate.basis")]
    public void Invalid_rates_are_named(double value, RateBasis basis, int m, string field)
    {
        var errors = AnnualRate.Check(value, basis, m, "rate");
        Assert.Equal(field, Assert.Single(errors).Field);
        Assert.Throws<ArgumentOutOfRangeException>(() => AnnualRate.Create(value, basis, m));
    }

    [Theory]
    [InlineData(0.04, 0.03, 0.0712)]
    [InlineData(0.02, 0.025, 0.0455)]
    [InlineData(-0.01, 0.05, 0.0395)]
    public void Market_rate_combines_real_rate_and_inflation(double real, double inflation, double market)
    {
        // Fisher (1930): 1 + market = (1 + real)(1 + inflation).
        Close.Relative(market, InflationAdjustment.MarketRate(real, inflation), 1e-13);
        Close.Assert(real, InflationAdjustment.RealRate(market, inflation), 1e-15);
    }
}
