using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// A series that changes by a fixed <paramref name="Step"/> each period: <paramref name="Amount"/> at
/// <paramref name="First"/>, Amount + Step at the next period, and so on to <paramref name="Last"/>.
/// </summary>
public sealed record ArithmeticGradientSeries(string Label, CashFlowCategory Category, int First, int Last, double Amount, double Step)
    : CashFlowElement(Label, Category)
{
    public override int FirstPeriod => First;

    public override int LastPeriod => Last;

    internal override string GrowthField => "step";

    public override void AddTo(Span<double> flows)
    {
        for (int t = First; t <= Last; t++)
        {
            flows[t] += Amount + Step * (t - First);
        }
    }

    /// <summary>[A (P/A, i, N) + G (P/G, i, N)](P/F, i, a − 1), N = b − a + 1.</summary>
    public override double PresentWorth(double i)
    {
        int n = Last - First + 1;
        return (Amount * CompoundInterest.UniformSeriesPresentWorth(i, n) + Step * CompoundInterest.ArithmeticGradientPresentWorth(i, n))
            * CompoundInterest.SinglePaymentPresentWorth(i, First - 1);
    }

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        CheckSpan(First, Last, horizon, path, errors);
        CheckAmount(Amount, "amount", path, errors);
        CheckAmount(Step, "step", path, errors);
    }
}
