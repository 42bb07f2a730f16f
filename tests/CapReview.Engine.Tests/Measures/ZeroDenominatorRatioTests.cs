using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Measures;

/// <summary>
/// A benefit-cost ratio whose denominator is exactly zero: ASTM E964 divides by the investment (net of salvage, plus
/// the operating costs in the conventional form) and a zero one has no ratio (the engine's rule, docs/methods.md:
/// undefined when the denominator is not positive). Zero in exact arithmetic must stay zero when its parts are
/// computed in binary from different closed forms; reference: the same worths summed in System.Decimal.
/// </summary>
public class ZeroDenominatorRatioTests
{
    // Capital paid as a level 100 a period, salvage (a deposit returned) as ten single amounts of 100: I − S is zero
    // at every rate, though I comes from (P/A) and S from ten (P/F)s.
    private static CashFlowModel Leased(params CashFlowElement[] others) => Models.Valid(10, 1,
        [
            new UniformSeries("Rent of the plant", Capital, 1, 10, -100),
            .. Enumerable.Range(1, 10).Select(t => (CashFlowElement)new SingleAmount($"Deposit back {t}", Salvage, t, 100)),
            new UniformSeries("Savings", Revenue, 1, 10, 60),
            .. others,
        ]);

    private static decimal DecimalWorth(decimal amount, decimal i, int t)
    {
        decimal v = 1m / (1m + i), power = 1m;
        for (int k = 0; k < t; k++)
        {
            power *= v;
        }
        return amount * power;
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.03)]
    [InlineData(0.07)]
    [InlineData(0.08)]
    [InlineData(0.1)]
    [InlineData(0.13)]
    [InlineData(0.17)]
    [InlineData(-0.05)]
    public void A_denominator_zero_in_exact_arithmetic_gives_no_ratio(double rate)
    {
        // Exact: I and S are both Σ 100 v^t over 1 … 10, to 28 digits in decimal.
        decimal i = (decimal)rate;
        decimal capital = Enumerable.Range(1, 10).Sum(t => DecimalWorth(100m, i, t));
        Assert.Equal(0m, capital - Enumerable.Range(1, 10).Sum(t => DecimalWorth(100m, i, t)));

        var ratio = BenefitCostRatio.Compute(Leased(), rate);
        Assert.Null(ratio.Modified);
        Assert.Null(ratio.Conventional);
        var evaluation = ModelEvaluator.Evaluate(Leased(), new EvaluationOptions(AnnualRate.Effective(rate)));
        Assert.Equal(UnavailableMeasures.DenominatorNotPositive, evaluation.Unavailable[UnavailableMeasures.ModifiedRatio]);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.08)]
    [InlineData(0.13)]
    public void With_operating_costs_the_conventional_ratio_stands_and_the_modified_has_none(double rate)
    {
        // O = Σ 20 v^t: the conventional ratio is B/O = 60/20 = 3 at every rate (the level series cancel); the modified
        // one divides by I − S = 0 and has none.
        var ratio = BenefitCostRatio.Compute(Leased(new UniformSeries("Upkeep", Operating, 1, 10, -20)), rate);
        Close.Assert(3.0, ratio.Conventional!.Value, 1e-12);
        Assert.Null(ratio.Modified);
    }

    [Fact]
    public void A_conventional_denominator_zero_in_exact_arithmetic_gives_no_ratio()
    {
        // I = 1,000 now, S = 400 now and operating income of 60 a period entered as a negative cost over ten periods
        // at 0%: I − S + O = 1,000 − 400 − 600 = 0 (hand sum), though O is a sum of ten binary terms.
        var model = Models.Valid(10, 1,
            new SingleAmount("Plant", Capital, 0, -1_000),
            new SingleAmount("Trade-in", Salvage, 0, 400),
            new UniformSeries("Scrap sales", Operating, 1, 10, 60),
            new UniformSeries("Savings", Revenue, 1, 10, 90));
        var ratio = BenefitCostRatio.Compute(model, 0.0);
        Assert.Null(ratio.Conventional);
        Close.Assert((900.0 + 600) / 600, ratio.Modified!.Value, 1e-12);
    }
}
