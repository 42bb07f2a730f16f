using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

public class MarrWhatIfTests
{
    // Quick payback against a larger late return, equal four-year lives (invented figures).
    private static readonly CashFlowModel Quick = Models.Valid(4, 1,
        new SingleAmount("Cost", Capital, 0, -10_000), new UniformSeries("Savings", Revenue, 1, 4, 3_600));

    private static readonly CashFlowModel Late = Models.Valid(4, 1,
        new SingleAmount("Cost", Capital, 0, -10_000), new ArithmeticGradientSeries("Savings", Revenue, 1, 4, 1_000, 2_500));

    [Fact]
    public void Two_proposals_swap_order_at_the_rate_of_return_of_their_difference()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.IRR of the difference of the flows.
        double[] difference = Quick.NetFlows.Zip(Late.NetFlows, (a, b) => a - b).ToArray();
        double[] copy = [.. difference];
        double expected = Financial.IRR(ref copy, 0.1);
        var swap = Assert.Single(MarrWhatIf.SwapRates(Quick, Late, 0.0, 0.5));
        Close.Assert(expected, swap, 1e-9);
        Assert.True(MarrWhatIf.AnnualWorthAt(Late, swap - 0.02) > MarrWhatIf.AnnualWorthAt(Quick, swap - 0.02));
        Assert.True(MarrWhatIf.AnnualWorthAt(Late, swap + 0.02) < MarrWhatIf.AnnualWorthAt(Quick, swap + 0.02));
    }

    [Fact]
    public void Annual_worth_at_another_marr_matches_capital_recovery() =>
        // Microsoft.VisualBasic.Financial.Pmt gives (A/P, 12%, 4).
        Close.Assert(3_600 - Financial.Pmt(0.12, 4, -10_000), MarrWhatIf.AnnualWorthAt(Quick, 0.12), 1e-10);

    [Fact]
    public void Proposals_that_never_swap_have_no_swap_rate()
    {
        var better = Models.Valid(4, 1, new SingleAmount("Cost", Capital, 0, -9_000), new UniformSeries("Savings", Revenue, 1, 4, 3_600));
        Assert.Empty(MarrWhatIf.SwapRates(Quick, better, 0.0, 1.0));
    }
}
