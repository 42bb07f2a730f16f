using CapReview.Engine.Measures;
using CsCheck;

namespace CapReview.Engine.Tests.Measures;

public class FlowSignsTests
{
    [Fact]
    public void Four_at_a_time_agrees_with_one_at_a_time() =>
        Gen.Double[-1e6, 1e6].Where(f => f != 0).Array[8, 120].Sample(flows =>
        {
            var one = FlowSigns.AccumulateOneAtATime(flows);
            var four = FlowSigns.AccumulateFourAtATime(flows)!.Value;
            double scale = one.Gross * 1e-12 * flows.Length;
            return one.Changes == four.Changes
                && Math.Abs(one.Total - four.Total) <= scale
                && Math.Abs(one.Gross - four.Gross) <= scale
                && Math.Abs(one.Receipts - four.Receipts) <= scale
                && Math.Abs(one.ReceiptTime - four.ReceiptTime) <= scale * flows.Length
                && Math.Abs(one.PaymentTime - four.PaymentTime) <= scale * flows.Length
                && one.FirstNonZero == four.FirstNonZero && one.LastNonZero == four.LastNonZero;
        });

    [Fact]
    public void A_zero_flow_sends_the_sequence_one_at_a_time() =>
        Assert.Null(FlowSigns.AccumulateFourAtATime([-5, 1, 1, 0, 1, 1, 1, 1, 1]));

    [Fact]
    public void One_sign_change_gives_the_cumulative_count_from_the_total()
    {
        var recovered = FlowSigns.Of([-100, 0, 30, 40, 50]);
        Assert.Equal((1, 1, true), (recovered.FlowChanges, recovered.ForwardCumulativeChanges, recovered.CumulativeTestPassed));
        var never = FlowSigns.Of([-100, 0, 30, 40, 20]);
        Assert.Equal((1, 0, false), (never.FlowChanges, never.ForwardCumulativeChanges, never.CumulativeTestPassed));
    }

    [Fact]
    public void Running_sums_that_return_to_zero_by_rounding_count_as_zero()
    {
        // 0.1 + 0.2 − 0.3 is 5.6e-17 in binary: the running sum there is zero within its rounding.
        var signs = FlowSigns.Of([0.1, 0.2, -0.3, -0.5, 1.0]);
        Assert.Equal(2, signs.FlowChanges);
        Assert.Equal(2, signs.ForwardCumulativeChanges);
    }
}
