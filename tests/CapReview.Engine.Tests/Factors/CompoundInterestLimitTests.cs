using CapReview.Engine.Factors;
using CapReview.Engine.Tests.Support;

namespace CapReview.Engine.Tests.Factors;

/// <summary>Limits at i = 0 and behaviour for tiny rates and long horizons.</summary>
public class CompoundInterestLimitTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(12)]
    [InlineData(1200)]
    public void At_zero_rate_every_factor_takes_its_limit(int n)
    {
        // Closed-form limits at i = 0: common practice, no source.
        Assert.Equal(1.0, CompoundInterest.SinglePaymentCompoundAmount(0.0, n));
        Assert.Equal(1.0, CompoundInterest.SinglePaymentPresentWorth(0.0, n));
        Assert.Equal(n, CompoundInterest.UniformSeriesCompoundAmount(0.0, n));
        Assert.Equal(n, CompoundInterest.UniformSeriesPresentWorth(0.0, n));
        Assert.Equal(1.0 / n, CompoundInterest.CapitalRecovery(0.0, n), 15);
        Assert.Equal(1.0 / n, CompoundInterest.SinkingFund(0.0, n), 15);
        Assert.Equal(n * (n - 1) / 2.0, CompoundInterest.ArithmeticGradientPresentWorth(0.0, n));
        Assert.Equal((n - 1) / 2.0, CompoundInterest.ArithmeticGradientUniformSeries(0.0, n), 12);
        Assert.Equal(n, CompoundInterest.GeometricGradientPresentWorth(0.0, 0.0, n));
    }

    [Theory]
    [InlineData("0.000000001", 10)]
    [InlineData("0.000000001", 1200)]
    [InlineData("-0.000000001", 360)]
    [InlineData("0.0000001", 1200)]
    [InlineData("0.00001", 600)]
    [InlineData("0.01", 1200)]
    public void Tiny_rates_and_long_horizons_match_exact_decimal_summation(string rate, int n)
    {
        decimal i = decimal.Parse(rate, System.Globalization.CultureInfo.InvariantCulture);
        double d = (double)i;
        Close.Relative(DecimalReference.UniformSeriesPresentWorth(i, n), CompoundInterest.UniformSeriesPresentWorth(d, n), 1e-13, "P/A");
        Close.Relative(DecimalReference.ArithmeticGradientPresentWorth(i, n), CompoundInterest.ArithmeticGradientPresentWorth(d, n), 1e-12, "P/G");
        Close.Relative(DecimalReference.GeometricGradientPresentWorth(i, 0.002m, n), CompoundInterest.GeometricGradientPresentWorth(d, 0.002, n), 1e-12, "P/A1");
        // (F/P) − 1 is where a naive (1 + i)^n loses the rate: compare it through (F/A) i.
        Close.Relative(DecimalReference.CompoundAmountMinusOne(i, n), CompoundInterest.UniformSeriesCompoundAmount(d, n) * d, 1e-13, "F/P - 1");
    }

    [Theory]
    [InlineData(0.07, 0.07, 15)]
    [InlineData(0.07, 0.0700000001, 15)]
    [InlineData(0.05, 0.049999999, 30)]
    public void Geometric_gradient_is_continuous_through_i_equal_g(double i, double g, int n)
    {
        // The i = g case is n / (1 + i): common practice, no source.
        Close.Relative(n / (1 + i), CompoundInterest.GeometricGradientPresentWorth(i, g, n), 1e-7);
        if (i == g)
        {
            Assert.Equal(n / (1 + i), CompoundInterest.GeometricGradientPresentWorth(i, g, n), 14);
        }
    }

    [Fact]
    public void Factors_stay_finite_at_the_top_of_the_rate_range_over_1200_periods()
    {
        Assert.Equal(10.0, CompoundInterest.CapitalRecovery(10.0, 1200), 12);
        Assert.Equal(0.1, CompoundInterest.UniformSeriesPresentWorth(10.0, 1200), 12);
        Assert.Equal(0.01, CompoundInterest.ArithmeticGradientPresentWorth(10.0, 1200), 12);
        Assert.Equal(0.0, CompoundInterest.SinglePaymentPresentWorth(10.0, 1200));
    }

    [Theory]
    [InlineData(-1.0)]
    [InlineData(-1.5)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Rates_at_or_below_minus_100_percent_are_refused(double i) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CompoundInterest.UniformSeriesPresentWorth(i, 10));

    [Theory]
    [InlineData(-1)]
    [InlineData(1201)]
    public void Period_counts_outside_0_to_1200_are_refused(int n) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CompoundInterest.UniformSeriesPresentWorth(0.05, n));

    [Fact]
    public void Capital_recovery_needs_at_least_one_period() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CompoundInterest.CapitalRecovery(0.05, 0));
}
