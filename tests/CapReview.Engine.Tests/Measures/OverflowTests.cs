using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Tests.Support;

namespace CapReview.Engine.Tests.Measures;

/// <summary>Measures whose intermediate sums once overflowed at the ends of the rate range, checked against closed forms.</summary>
public class OverflowTests
{
    [Fact]
    public void The_external_rate_at_1000_percent_over_1200_periods_is_a_number()
    {
        // −1 now, +1 at period 1 carried to period 1,200 at 1000%: (11^1199 / 1)^(1/1200) − 1 = e^(1199 ln 11 / 1200) − 1
        // (the definition's closed form, ASTM E1057). Carried as a sum, 11^1199 passes every double; the old result was NaN.
        var flows = new double[1201];
        flows[0] = -1;
        flows[1] = 1;
        double expected = Math.Exp(1199 * Math.Log(11) / 1200) - 1;
        Close.Relative(expected, ExternalRateOfReturn.Compute(flows, 10.0, 10.0)!.Value, 1e-13);
    }

    [Fact]
    public void The_external_rate_at_a_rate_near_minus_100_percent_is_a_number()
    {
        // −1 now, +1 at period 400, finance and reinvestment at −90% a period: (1 / 1)^(1/400) − 1 = 0 (closed form):
        // the payment brought to time 0 needs no growth, the receipt carried to 400 none either.
        var flows = new double[401];
        flows[0] = -1;
        flows[400] = 1;
        Assert.Equal(0.0, ExternalRateOfReturn.Compute(flows, -0.9, -0.9)!.Value, 15);
        // With the receipt now and the payment at period 400: receipts carried to 400 are 0.1^400, the payment brought
        // to time 0 is 10^400, and (10^−400 / 10^400)^(1/400) − 1 = 0.01 − 1 (closed form).
        flows[0] = 1;
        flows[400] = -1;
        Close.Relative(-0.99, ExternalRateOfReturn.Compute(flows, -0.9, -0.9)!.Value, 1e-12);
    }

    [Fact]
    public void Discounted_payback_at_a_rate_near_minus_100_percent_follows_the_worth_at_each_period()
    {
        // −1 now, nothing for 399 periods, +1 at 400, at −90% a period: the receipt is worth 10^400 at time 0, so the
        // investment is recovered a vanishing fraction into period 400: 399 + 1/10^400 = 399 (closed form). The
        // discount factor 10^t passes every double from t = 309; the old loop turned 0 × ∞ into NaN and said never.
        var flows = new double[401];
        flows[0] = -1;
        flows[400] = 1;
        Assert.Equal(399.0, Payback.Discounted(flows, -0.9)!.Value, 12);
        // And at −50% a period, −100 now and 30 at period 2: −100 + 30 · 4 = 20 ≥ 0 in period 2, 100/120 of it (closed form).
        Assert.Equal(1 + 100.0 / 120, Payback.Discounted([-100, 0, 30], -0.5)!.Value, 14);
    }

    [Theory]
    [InlineData(1e-170, 1200)]
    [InlineData(1e-300, 1200)]
    [InlineData(5e-324, 2)]
    [InlineData(-1e-250, 600)]
    public void The_arithmetic_gradient_factor_takes_its_limit_at_vanishing_rates(double i, int n)
    {
        // (P/G, 0, n) = n(n − 1)/2, the factor's closed-form limit (common practice, no source); i² underflowed to zero
        // here and the factor was 0/0.
        Assert.Equal(n * (n - 1) / 2.0, CompoundInterest.ArithmeticGradientPresentWorth(i, n), 1e-9);
        Assert.Equal((n - 1) / 2.0, CompoundInterest.ArithmeticGradientUniformSeries(i, n), 1e-12);
    }

    [Fact]
    public void The_geometric_factor_at_growth_near_minus_100_percent_against_a_large_rate_is_a_number()
    {
        // A₁ = 1 at period 1 then shrinking to nothing: Σ (1 + g)^(t−1) (1 + i)^−t with 1 + g = 1e-9 and i = 10 is
        // 1/11 + 1e-9/121 + … ≈ 1/11 (1 + 1e-9/11) (the series' own first terms, common practice, no source).
        Close.Relative(1.0 / 11 * (1 + 1e-9 / 11), CompoundInterest.GeometricGradientPresentWorth(10.0, -1 + 1e-9, 1200), 1e-12);
    }
}
