using CapReview.Engine.Factors;
using CsCheck;

namespace CapReview.Engine.Tests.Factors;

/// <summary>Identities among the factors (common practice, no source), over random rates and horizons.</summary>
public class FactorProperties
{
    private static readonly Gen<double> Rate = Gen.OneOf(
        Gen.Double[-0.5, 2.0],
        Gen.Double[-1e-6, 1e-6],
        Gen.Const(0.0));

    private static readonly Gen<int> Periods = Gen.Int[1, 1200];

    /// <summary>Rates and horizons whose powers (1 + i)^±n are representable doubles (|n ln(1 + i)| ≤ 700).</summary>
    private static readonly Gen<(double Rate, int Periods)> Representable =
        Gen.Select(Rate, Periods).Where(p => Math.Abs(p.Item2 * Math.Log(1 + p.Item1)) <= 700);

    [Fact]
    public void Compound_amount_times_present_worth_is_one() =>
        Representable.Sample(p =>
            Math.Abs(CompoundInterest.SinglePaymentCompoundAmount(p.Rate, p.Periods) * CompoundInterest.SinglePaymentPresentWorth(p.Rate, p.Periods) - 1.0) < 1e-13);

    [Fact]
    public void Capital_recovery_is_sinking_fund_plus_the_rate() =>
        Gen.Select(Gen.Double[-0.2, 2.0], Gen.Int[1, 400]).Sample((i, n) =>
        {
            double ap = CompoundInterest.CapitalRecovery(i, n);
            double af = CompoundInterest.SinkingFund(i, n);
            return Math.Abs(ap - (af + i)) <= 1e-12 * Math.Max(1.0, Math.Abs(ap));
        });

    [Fact]
    public void Uniform_series_present_worth_is_compound_amount_discounted() =>
        Representable.Sample(((double Rate, int Periods) p) =>
        {
            (double i, int n) = p;
            double pa = CompoundInterest.UniformSeriesPresentWorth(i, n);
            double viaFuture = CompoundInterest.UniformSeriesCompoundAmount(i, n) * CompoundInterest.SinglePaymentPresentWorth(i, n);
            return Math.Abs(pa - viaFuture) <= 1e-12 * Math.Abs(pa);
        });
}
