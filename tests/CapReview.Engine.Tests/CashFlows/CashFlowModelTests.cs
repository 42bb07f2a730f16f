using CapReview.Engine.CashFlows;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.CashFlows;

public class CashFlowModelTests
{
    [Fact]
    public void Elements_expand_to_net_flows_per_period()
    {
        double[] flows = Models.Flows(6,
            new SingleAmount("First cost", Capital, 0, -1000),
            new UniformSeries("Upkeep", Operating, 1, 6, -50),
            new ArithmeticGradientSeries("Savings", Revenue, 2, 4, 100, 25),
            new GeometricGradientSeries("Energy", Revenue, 1, 3, 200, 0.10),
            new RecurringAmount("Overhaul", Capital, 2, 6, 2, -80),
            new SingleAmount("Resale", Salvage, 6, 150));
        double[] expected =
        [
            -1000,
            -50 + 200,
            -50 + 100 + 220 - 80,
            -50 + 125 + 242,
            -50 + 150 - 80,
            -50,
            -50 - 80 + 150,
        ];
        Assert.Equal(expected.Length, flows.Length);
        for (int t = 0; t < expected.Length; t++)
        {
            Assert.Equal(expected[t], flows[t], 10);
        }
    }

    [Fact]
    public void Closed_form_present_worth_matches_NPV_of_the_expanded_flows()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.NPV discounts its first value by one period.
        var model = Models.Valid(12, 1,
            new SingleAmount("First cost", Capital, 0, -185_000),
            new GeometricGradientSeries("Energy saved", Revenue, 1, 12, 42_000, 0.03),
            new ArithmeticGradientSeries("Upkeep", Operating, 1, 12, -3_500, -250),
            new RecurringAmount("Overhaul", Capital, 4, 11, 4, -18_000),
            new SingleAmount("Resale", Salvage, 12, 15_000));
        double[] later = model.NetFlows.Skip(1).ToArray();
        double expected = model.NetFlows[0] + Financial.NPV(0.08, ref later);
        Close.Assert(expected, model.ClosedFormPresentWorth(0.08), 1e-12);
    }

    [Fact]
    public void Element_flows_can_be_listed_one_element_at_a_time()
    {
        var model = Models.Valid(5, 1,
            new SingleAmount("First cost", Capital, 0, -100),
            new RecurringAmount("Overhaul", Capital, 1, 5, 2, -10));
        Assert.Equal([0, -10, 0, -10, 0, -10], model.FlowsOf(1));
        Assert.Equal(3, ((RecurringAmount)model.Elements[1]).Occurrences);
        Assert.Equal(5, model.Elements[1].LastPeriod);
    }

    [Fact]
    public void Years_follow_the_period_length() =>
        Assert.Equal(2.5, Models.Valid(30, 12, new SingleAmount("x", Capital, 0, -1)).Years);
}
