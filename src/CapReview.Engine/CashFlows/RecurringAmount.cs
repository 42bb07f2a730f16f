using CapReview.Engine.Factors;
using CapReview.Engine.Numerics;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// An amount that recurs every <paramref name="Every"/> periods: at <paramref name="First"/>, First + k, … while not
/// after <paramref name="Last"/> (overhauls, periodic replacements).
/// </summary>
public sealed record RecurringAmount(string Label, CashFlowCategory Category, int First, int Last, int Every, double Amount)
    : CashFlowElement(Label, Category)
{
    /// <summary>How many times the amount occurs.</summary>
    public int Occurrences => Every >= 1 && Last >= First ? (Last - First) / Every + 1 : 0;

    public override int FirstPeriod => First;

    public override int LastPeriod => First + (Occurrences - 1) * Every;

    public override void AddTo(Span<double> flows)
    {
        for (int t = First; t <= Last; t += Every)
        {
            flows[t] += Amount;
        }
    }

    /// <summary>
    /// A (P/F, i, a − k)(P/A, i_k, M): M payments one k-period apart, where i_k = (1 + i)^k − 1 is the effective rate
    /// per k periods.
    /// </summary>
    public override double PresentWorth(double i)
    {
        CompoundInterest.CheckRate(i);
        double rateOverInterval = StableMath.Expm1(Every * StableMath.Log1p(i));
        if (!double.IsFinite(rateOverInterval) || rateOverInterval <= -1.0)
        {
            // (1 + i)^k is past every double, or rounds to 0 (a rate near −100% over a long interval, as an escalated
            // element's deflated rate can be): no closed form at i_k, so the M amounts are discounted one by one.
            double log = StableMath.Log1p(i), sum = 0.0;
            for (int t = First; t <= Last; t += Every)
            {
                sum += Math.Exp(-t * log);
            }
            return Amount * sum;
        }
        return Amount * CompoundInterest.SinglePaymentPresentWorth(i, First - Every)
            * CompoundInterest.UniformSeriesPresentWorth(rateOverInterval, Occurrences);
    }

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        CheckSpan(First, Last, horizon, path, errors);
        if (Every < 1)
        {
            errors.Add(new($"{path}.every", "The interval must be at least one period."));
        }
        else if (Every > CompoundInterest.MaxPeriods)
        {
            errors.Add(new($"{path}.every", "The interval is longer than the longest horizon."));
        }
        CheckAmount(Amount, "amount", path, errors);
    }
}
