using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>One amount at the end of <paramref name="Period"/>: a first cost, a one-off cost, a salvage or market value.</summary>
public sealed record SingleAmount(string Label, CashFlowCategory Category, int Period, double Amount)
    : CashFlowElement(Label, Category)
{
    public override int FirstPeriod => Period;

    public override int LastPeriod => Period;

    public override void AddTo(Span<double> flows) => flows[Period] += Amount;

    /// <summary>A (P/F, i, t).</summary>
    public override double PresentWorth(double i) => Amount * CompoundInterest.SinglePaymentPresentWorth(i, Period);

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        if (Period < 0)
        {
            errors.Add(new($"{path}.period", "The period cannot be negative."));
        }
        else if (Period > horizon)
        {
            errors.Add(new($"{path}.period", Invariant($"The period is after the horizon ({horizon}).")));
        }
        CheckAmount(Amount, "amount", path, errors);
    }
}
