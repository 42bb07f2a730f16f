using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>The same amount at the end of every period from <paramref name="First"/> to <paramref name="Last"/>.</summary>
public sealed record UniformSeries(string Label, CashFlowCategory Category, int First, int Last, double Amount)
    : CashFlowElement(Label, Category)
{
    public override int FirstPeriod => First;

    public override int LastPeriod => Last;

    public override void AddTo(Span<double> flows)
    {
        for (int t = First; t <= Last; t++)
        {
            flows[t] += Amount;
        }
    }

    /// <summary>A (P/A, i, N)(P/F, i, a − 1), N = b − a + 1.</summary>
    public override double PresentWorth(double i) =>
        Amount * CompoundInterest.UniformSeriesPresentWorth(i, Last - First + 1) * CompoundInterest.SinglePaymentPresentWorth(i, First - 1);

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        CheckSpan(First, Last, horizon, path, errors);
        CheckAmount(Amount, "amount", path, errors);
    }
}
