using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Inflation;
using CapReview.Engine.Measures;
using CapReview.Engine.Specifications;
using CapReview.Engine.Tests.Support;
using CsCheck;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Inflation;

public class InflationSpecificationTests
{
    private static ModelSpec Plant(MoneyBasis? money, double? escalation, InflationSpec? inflation, double marr) => new()
    {
        Horizon = 10,
        PeriodsPerYear = 1,
        Rate = new RateSpec { Value = marr },
        Inflation = inflation,
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Energy saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 70_000, Money = money, Escalation = escalation },
        ],
    };

    [Fact]
    public void Constant_money_at_a_real_MARR_is_worth_what_the_real_flows_are_worth_at_that_rate()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.PV of the real series at the real 7 %. The engine escalates
        // the savings at 3 % into actual money and discounts them at the market rate 1.07 × 1.03 − 1.
        var outcome = Evaluator.Evaluate(Plant(MoneyBasis.Constant, null, new InflationSpec { Rate = 0.03, RealMarr = true }, 0.07));
        Assert.True(outcome.IsValid);
        Close.Assert(-400_000 - Financial.PV(0.07, 10, 70_000), outcome.Value!.PresentWorth, 1e-10);
        Close.Assert(1.07 * 1.03 - 1, outcome.Value.Marr.EffectiveAnnual(), 1e-14);
        Close.Assert(70_000 * 1.03, outcome.Value.NetFlows[1], 1e-12);
    }

    [Fact]
    public void An_escalation_of_its_own_overrides_general_inflation()
    {
        // Savings escalating at 5 % in actual money, at a market MARR of 10 %: the geometric-series worth, checked with
        // Financial.NPV of the expanded amounts.
        var outcome = Evaluator.Evaluate(Plant(MoneyBasis.Constant, 0.05, new InflationSpec { Rate = 0.02 }, 0.10));
        double[] savings = [.. Enumerable.Range(1, 10).Select(t => 70_000 * Math.Pow(1.05, t))];
        Close.Assert(-400_000 + Financial.NPV(0.10, ref savings), outcome.Value!.PresentWorth, 1e-10);
    }

    [Fact]
    public void Missing_or_bad_inflation_is_named_by_field()
    {
        var noRate = Evaluator.Evaluate(Plant(MoneyBasis.Constant, null, null, 0.10));
        Assert.Contains(noRate.Errors, e => e.Field == "elements[1].escalation");
        var bad = Evaluator.Evaluate(Plant(null, null, new InflationSpec { Rate = -1.5 }, 0.10));
        Assert.Contains(bad.Errors, e => e.Field == "inflation.rate");
        Assert.Contains(Evaluator.Evaluate(Plant(null, null, new InflationSpec { Rate = 0.02, BaseYear = -1 }, 0.10)).Errors, e => e.Field == "inflation.baseYear");
    }

    [Fact]
    public void An_escalated_elements_closed_form_worth_equals_its_expanded_flows() =>
        // The identity Σ f (1 + g)^(t − b) (1 + i)^(−t) = (1 + g)^(−b) PW(i′), (1 + i′) = (1 + i)/(1 + g); no source.
        Gen.Select(Gen.Double[-0.05, 0.3], Gen.Double[-0.05, 0.2], Gen.Int[0, 5], Gen.Int[1, 60]).Sample((i, g, basePeriod, n) =>
        {
            var inner = new GeometricGradientSeries("Wages", CashFlowCategory.Operating, 1, n, -1_000, 0.01);
            var element = new EscalatedElement(inner, g, basePeriod);
            var flows = new double[n + 1];
            element.AddTo(flows);
            double expanded = FlowWorth.PresentWorth(flows, i), closed = element.PresentWorth(i);
            return Math.Abs(expanded - closed) <= 1e-9 * Math.Max(1, Math.Abs(expanded));
        });
}
