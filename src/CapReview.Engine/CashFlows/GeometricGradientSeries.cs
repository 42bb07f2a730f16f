using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// A series that grows by a fixed percentage each period: <paramref name="Amount"/> at <paramref name="First"/>,
/// Amount (1 + g) at the next period, and so on to <paramref name="Last"/>.
/// </summary>
public sealed record GeometricGradientSeries(string Label, CashFlowCategory Category, int First, int Last, double Amount, double Growth)
    : CashFlowElement(Label, Category)
{
    /// <summary>Highest growth per period accepted: 1000%.</summary>
    public const double MaxGrowth = 10.0;

    public override int FirstPeriod => First;

    public override int LastPeriod => Last;

    internal override string GrowthField => "growth";

    public override void AddTo(Span<double> flows)
    {
        double log1pGrowth = Numerics.StableMath.Log1p(Growth);
        for (int t = First; t <= Last; t++)
        {
            flows[t] += Amount * Math.Exp((t - First) * log1pGrowth);
        }
    }

    /// <summary>A (P/A₁, g, i, N)(P/F, i, a − 1), N = b − a + 1.</summary>
    public override double PresentWorth(double i) =>
        Amount * CompoundInterest.GeometricGradientPresentWorth(i, Growth, Last - First + 1)
        * CompoundInterest.SinglePaymentPresentWorth(i, First - 1);

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        CheckSpan(First, Last, horizon, path, errors);
        CheckAmount(Amount, "amount", path, errors);
        if (!double.IsFinite(Growth))
        {
            errors.Add(new($"{path}.growth", "Enter a finite growth rate."));
        }
        else if (Growth <= -1.0 || Growth > MaxGrowth)
        {
            errors.Add(new($"{path}.growth", "The growth per period must be above -100% and at most 1000%."));
        }
    }
}
