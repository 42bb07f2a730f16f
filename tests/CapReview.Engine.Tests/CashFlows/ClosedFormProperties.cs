using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CsCheck;

namespace CapReview.Engine.Tests.CashFlows;

/// <summary>The closed form from the factors equals the present worth of the expanded flows (common practice, no source).</summary>
public class ClosedFormProperties
{
    private static Gen<CashFlowElement> Element(int horizon)
    {
        var span = Gen.Select(Gen.Int[0, horizon], Gen.Int[0, horizon]).Select(p => (First: Math.Min(p.Item1, p.Item2), Last: Math.Max(p.Item1, p.Item2)));
        var amount = Gen.Double[-1e6, 1e6];
        var category = Gen.Enum<CashFlowCategory>();
        return Gen.OneOf<CashFlowElement>(
            Gen.Select(category, Gen.Int[0, horizon], amount, (c, t, a) => (CashFlowElement)new SingleAmount("single", c, t, a)),
            Gen.Select(category, span, amount, (c, s, a) => (CashFlowElement)new UniformSeries("uniform", c, s.First, s.Last, a)),
            Gen.Select(category, span, amount, Gen.Double[-1e4, 1e4], (c, s, a, g) => (CashFlowElement)new ArithmeticGradientSeries("arithmetic", c, s.First, s.Last, a, g)),
            Gen.Select(category, span, amount, Gen.Double[-0.2, 0.2], (c, s, a, g) => (CashFlowElement)new GeometricGradientSeries("geometric", c, s.First, s.Last, a, g)),
            Gen.Select(category, span, amount, Gen.Int[1, 10], (c, s, a, k) => (CashFlowElement)new RecurringAmount("recurring", c, s.First, s.Last, k, a)));
    }

    private static readonly Gen<(CashFlowModel Model, double Rate)> ModelAndRate =
        Gen.Int[1, 1200].SelectMany(horizon =>
            Gen.Select(Element(horizon).Array[1, 10], Gen.OneOf(Gen.Double[-0.05, 0.5], Gen.Double[-1e-8, 1e-8], Gen.Const(0.0)),
                (elements, rate) => (Model: CashFlowModel.Create(horizon, 1, elements).Value!, Rate: rate)))
        .Where(p => p.Model is not null);

    [Fact]
    public void Closed_form_agrees_with_the_expanded_flows_to_1e_9_relative() =>
        ModelAndRate.Sample(p =>
        {
            double[] flows = [.. p.Model.NetFlows];
            double expanded = FlowWorth.PresentWorth(flows, p.Rate);
            double closed = p.Model.ClosedFormPresentWorth(p.Rate);
            // Relative to the gross worth Σ|F_t|(1 + i)^−t, so that a worth near zero is judged fairly.
            double scale = Math.Max(1.0, FlowWorth.PresentWorth(flows.Select(Math.Abs).ToArray(), p.Rate));
            return Math.Abs(expanded - closed) <= 1e-9 * scale;
        }, iter: 500);
}
