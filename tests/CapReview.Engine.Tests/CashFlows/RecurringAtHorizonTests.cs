using CapReview.Engine.CashFlows;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.CashFlows;

/// <summary>
/// A recurring amount whose last occurrence falls on the horizon: it occurs there (the element's rule, "A at a, a + k,
/// … ≤ b"), and its closed form counts it. Outside reference: Microsoft.VisualBasic.Financial.NPV of the flows written
/// out by hand (NPV discounts its first value by one period).
/// </summary>
public class RecurringAtHorizonTests
{
    private static double Npv(double rate, double[] flows)
    {
        double[] later = flows[1..];
        return flows[0] + Financial.NPV(rate, ref later);
    }

    [Theory]
    // first, last, every, horizon: occurrences written out beside each.
    [InlineData(4, 12, 4, 12)]   // 4, 8, 12
    [InlineData(0, 12, 12, 12)]  // 0, 12: the closed form starts a full interval before period 0
    [InlineData(12, 12, 5, 12)]  // 12 alone
    [InlineData(3, 12, 3, 12)]   // 3, 6, 9, 12
    [InlineData(1, 12, 1, 12)]   // every period, 1 … 12
    public void The_occurrence_on_the_horizon_is_a_flow_and_is_worth_its_discounted_amount(int first, int last, int every, int horizon)
    {
        var model = Models.Valid(horizon, 1, new RecurringAmount("Overhaul", Capital, first, last, every, -18_000));
        double[] expected = new double[horizon + 1];
        for (int t = first; t <= last; t += every)
        {
            expected[t] = -18_000;
        }
        Assert.Equal(expected, model.NetFlows);
        Assert.Equal(horizon, model.Elements[0].LastPeriod);
        Close.Assert(Npv(0.08, expected), model.ClosedFormPresentWorth(0.08), 1e-12);
        Close.Assert(Npv(-0.05, expected), model.ClosedFormPresentWorth(-0.05), 1e-12);
        Close.Assert(expected.Sum(), model.ClosedFormPresentWorth(0.0), 1e-12);
    }

    [Fact]
    public void A_last_period_past_the_final_occurrence_but_after_the_horizon_is_refused()
    {
        // "Last" is the last period the amount may fall in, and must lie within the horizon like every element's.
        var outcome = CashFlowModel.Create(12, 1, [new RecurringAmount("Overhaul", Capital, 4, 14, 4, -18_000)]);
        Assert.Equal("elements[0].last", Assert.Single(outcome.Errors).Field);
    }

    [Fact]
    public void An_escalated_amount_recurring_to_the_horizon_is_escalated_there_too()
    {
        // 3% a period from period 0: the occurrence at 12 is 1,000 × 1.03^12; hand computation of the flows.
        var model = Models.Valid(12, 1, new EscalatedElement(new RecurringAmount("Overhaul", Capital, 4, 12, 4, -1_000), 0.03, 0));
        double[] expected = new double[13];
        foreach (int t in new[] { 4, 8, 12 })
        {
            expected[t] = -1_000 * Math.Pow(1.03, t);
        }
        for (int t = 0; t <= 12; t++)
        {
            Close.Assert(expected[t], model.NetFlows[t], 1e-12, $"period {t}");
        }
        Close.Assert(Npv(0.08, expected), model.ClosedFormPresentWorth(0.08), 1e-12);
    }
}
