using CapReview.Engine.Measures;

namespace CapReview.Engine.Tests.Measures;

/// <summary>
/// Payback exactly at the end of a period: the cumulative flow is zero there in exact arithmetic, so the investment is
/// recovered at that period, whatever the rounding of the running sum. ASTM E1121 defines payback as the time at which
/// the cumulative (discounted) savings equal the investment (from memory); the expected periods are hand sums in
/// exact decimals, written beside each case.
/// </summary>
public class PaybackAtPeriodEndTests
{
    public static TheoryData<double[], double, double> Cases() => new()
    {
        // −1,000 then 550 = 500 × 1.1 and 605 = 500 × 1.1²: discounted at 10%, 500 + 500 recovers 1,000 at period 2.
        { new[] { -1_000.0, 550, 605 }, 0.10, 2.0 },
        // At 5%: 420 = 400 × 1.05, 441 = 400 × 1.05², 231.525 = 200 × 1.05³: 400 + 400 + 200 = 1,000 at period 3.
        { new[] { -1_000.0, 420, 441, 231.525 }, 0.05, 3.0 },
        // At 7%, the recovery on the last period, with nothing after it: 107 + 114.49 = 100 × 1.07 + 100 × 1.07².
        { new[] { -200.0, 107, 114.49 }, 0.07, 2.0 },
        // At 8%, over four periods: 270 = 250 × 1.08, 291.6 = 250 × 1.08², 314.928, 340.12224.
        { new[] { -1_000.0, 270, 291.6, 314.928, 340.12224 }, 0.08, 4.0 },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void A_discounted_cumulative_that_returns_to_zero_at_a_period_end_pays_back_there(double[] flows, double rate, double expected) =>
        Assert.Equal(expected, Payback.Discounted(flows, rate));

    [Theory]
    // 0.1 + 0.2 and the like are not exact in binary: the running sum lands a rounding error either side of zero.
    [InlineData(new[] { -0.3, 0.1, 0.2 }, 2.0)]
    [InlineData(new[] { -100.3, 50.1, 50.2 }, 2.0)]
    [InlineData(new[] { -0.7, 0.1, 0.2, 0.4 }, 3.0)]
    [InlineData(new[] { -1_234.56, 411.52, 411.52, 411.52 }, 3.0)]
    public void A_simple_cumulative_that_returns_to_zero_at_a_period_end_pays_back_there(double[] flows, double expected) =>
        Assert.Equal(expected, Payback.Simple(flows));

    [Fact]
    public void A_running_sum_a_rounding_error_below_zero_is_no_investment()
    {
        // 0.3 − 0.1 − 0.2 is zero in exact arithmetic (−2.8e-17 in binary): nothing was invested, so the
        // receipts pay back at once, as flows that never dip below zero do.
        Assert.Equal(0.0, Payback.Simple([0.3, -0.1, -0.2, 0.0, 5.0]));
    }
}
