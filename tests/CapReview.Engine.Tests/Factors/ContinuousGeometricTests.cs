using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Factors;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Engine.Tests.Support;

namespace CapReview.Engine.Tests.Factors;

/// <summary>
/// A geometric series whose growth equals the rate per period when the MARR is compounded continuously: every
/// amount A₁(1 + g)^(t − 1) at t is worth A₁/(1 + i), so the series is worth n A₁/(1 + i), the limit of
/// (1 − ((1 + g)/(1 + i))^n)/(i − g) at i = g (common practice, no source: the sum written out). With continuous
/// compounding at a nominal r a year and p periods a year, i = e^(r/p) − 1.
/// </summary>
public class ContinuousGeometricTests
{
    [Theory]
    [InlineData(0.05, 1, 10)]
    [InlineData(0.12, 12, 120)]
    [InlineData(-0.03, 4, 40)]
    [InlineData(1e-12, 1, 25)]
    public void A_series_growing_at_the_continuous_rate_per_period_is_worth_n_amounts_over_one_plus_i(double r, int p, int n)
    {
        double i = Math.Exp(r / p) - 1;
        var spec = new ModelSpec
        {
            Horizon = n,
            PeriodsPerYear = p,
            Rate = new RateSpec { Value = r, Basis = RateBasis.Continuous },
            Elements = [new ElementSpec { Type = ElementKind.Geometric, Label = "Energy saved", Category = CashFlowCategory.Revenue, First = 1, Last = n, Amount = 1_000, Growth = i }],
        };
        var evaluation = Evaluator.Evaluate(spec);
        Assert.True(evaluation.IsValid, string.Join("; ", evaluation.Errors.Select(e => e.Message)));
        // The growth is entered per period here (the element's own), at exactly the rate the continuous MARR gives.
        double expected = n * 1_000 / (1 + i);
        Close.Assert(expected, evaluation.Value!.PresentWorth, 1e-12);
        Close.Assert(expected, evaluation.Value.PresentWorthOfNetFlows, 1e-12);
    }

    [Theory]
    [InlineData(0.05, 10)]
    [InlineData(0.0, 10)]
    [InlineData(-0.2, 30)]
    public void The_geometric_factor_at_the_rate_of_a_continuous_nominal_rate_is_its_limit(double r, int n)
    {
        // (P/A₁, g, i, n) at g = i = e^r − 1, computed either way round, against n/(1 + i); and next to it, a growth a
        // rounding away, which must not move the factor by more than rounding.
        double i = ContinuousCompounding.SinglePaymentCompoundAmount(r, 1) - 1;
        Close.Assert(n / (1 + i), CompoundInterest.GeometricGradientPresentWorth(i, i, n), 1e-14);
        Close.Assert(n / (1 + i), CompoundInterest.GeometricGradientPresentWorth(i, Math.BitIncrement(i), n), 1e-13);
        Close.Assert(n / (1 + i), CompoundInterest.GeometricGradientPresentWorth(Math.BitDecrement(i), i, n), 1e-13);
    }
}
