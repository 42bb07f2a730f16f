using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Evaluation;

public class EvaluatorTests
{
    private static ModelSpec Spec(double rate = 0.10, RateBasis basis = RateBasis.Effective, int? m = null, int periodsPerYear = 1, int horizon = 10, params ElementSpec[] elements) => new()
    {
        PeriodsPerYear = periodsPerYear,
        Horizon = horizon,
        Rate = new RateSpec { Value = rate, Basis = basis, CompoundingsPerYear = m },
        Elements = elements.Length > 0 ? elements :
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Machine", Category = CashFlowCategory.Capital, Period = 0, Amount = -10_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Savings", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 2_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 10, Amount = 1_000 },
        ],
    };

    private static Engine.Evaluation.Evaluation Evaluate(ModelSpec spec)
    {
        var outcome = Evaluator.Evaluate(spec);
        Assert.True(outcome.IsValid, string.Join("; ", outcome.Errors.Select(e => e.Field + ": " + e.Message)));
        return outcome.Value!;
    }

    [Fact]
    public void Annual_model_measures_match_VisualBasic_Financial()
    {
        var result = Evaluate(Spec());
        double[] flows = [.. result.NetFlows];
        double[] later = flows.Skip(1).ToArray();
        double pw = flows[0] + Financial.NPV(0.10, ref later);
        Close.Assert(pw, result.PresentWorth, 1e-12);
        Close.Assert(pw, result.PresentWorthOfNetFlows, 1e-12);
        Close.Assert(-Financial.FV(0.10, 10, 0, pw), result.FutureWorth!.Value, 1e-12);
        Close.Assert(-Financial.Pmt(0.10, 10, pw), result.AnnualWorth, 1e-12);
        Close.Assert(result.AnnualWorth, result.PeriodWorth, 1e-15);
        double[] copy = [.. flows];
        Close.Assert(Financial.IRR(ref copy, 0.1), result.UniqueRateOfReturn!.Value, 1e-9);
        copy = [.. flows];
        Close.Assert(Financial.MIRR(ref copy, 0.10, 0.10), result.ExternalRate!.Value, 1e-12);
        Close.Assert(result.PeriodWorth / 0.10, result.CapitalizedWorth!.Value, 1e-12);
        Assert.Equal(5.0, result.SimplePayback!.Value, 12);
        Assert.Equal(5.0, result.SimplePaybackYears!.Value, 12);
        Assert.Equal(RateOfReturnKind.Unique, result.RateOfReturnPerPeriod.Kind);
    }

    [Fact]
    public void Monthly_model_uses_the_monthly_rate_and_reports_annual_figures()
    {
        // 12% nominal compounded monthly with monthly periods: 1% a month exactly.
        var spec = Spec(0.12, RateBasis.Nominal, 12, periodsPerYear: 12, horizon: 24, elements:
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Tooling", Category = CashFlowCategory.Capital, Period = 0, Amount = -5_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Scrap saved", Category = CashFlowCategory.Revenue, First = 1, Last = 24, Amount = 260 },
        ]);
        var result = Evaluate(spec);
        Assert.Equal(0.01, result.MarrPerPeriod, 15);
        Close.Assert(-5000 - Financial.PV(0.01, 24, 260), result.PresentWorth, 1e-12);
        Close.Assert(-Financial.Pmt(0.01, 24, result.PresentWorth), result.PeriodWorth, 1e-12);
        // A year of equal monthly amounts is worth (F/A, 1%, 12) of them at the year end.
        Close.Assert(result.PeriodWorth * -Financial.FV(0.01, 12, 1), result.AnnualWorth, 1e-12);
        double monthlyIrr = Financial.Rate(24, 260, -5000);
        Close.Assert(Math.Pow(1 + monthlyIrr, 12) - 1, result.UniqueRateOfReturn!.Value, 1e-9);
        Assert.Equal(result.SimplePayback!.Value / 12, result.SimplePaybackYears!.Value, 12);
    }

    [Fact]
    public void Several_rates_of_return_are_all_reported_without_a_unique_one()
    {
        var spec = Spec(0.15, horizon: 3, elements:
        [
            new ElementSpec { Type = ElementKind.Single, Label = "a", Category = CashFlowCategory.Capital, Period = 0, Amount = -1000 },
            new ElementSpec { Type = ElementKind.Single, Label = "b", Category = CashFlowCategory.Revenue, Period = 1, Amount = 3600 },
            new ElementSpec { Type = ElementKind.Single, Label = "c", Category = CashFlowCategory.Operating, Period = 2, Amount = -4310 },
            new ElementSpec { Type = ElementKind.Single, Label = "d", Category = CashFlowCategory.Revenue, Period = 3, Amount = 1716 },
        ]);
        var result = Evaluate(spec);
        Assert.Equal(3, result.RatesOfReturn.Count);
        Assert.Null(result.UniqueRateOfReturn);
        Assert.NotNull(result.ExternalRate);
    }

    [Fact]
    public void Zero_marr_has_no_capitalized_worth()
    {
        var result = Evaluate(Spec(0.0));
        Assert.Null(result.CapitalizedWorth);
        Assert.Equal(result.NetFlows.Sum(), result.PresentWorth, 9);
    }

    [Fact]
    public void Future_worth_beyond_the_number_range_is_null()
    {
        var result = Evaluate(Spec(9.0, horizon: 1200, elements:
        [
            new ElementSpec { Type = ElementKind.Single, Label = "x", Category = CashFlowCategory.Capital, Period = 0, Amount = -1 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "y", Category = CashFlowCategory.Revenue, First = 1, Last = 1200, Amount = 2 },
        ]));
        Assert.Null(result.FutureWorth);
        Assert.True(double.IsFinite(result.AnnualWorth));
    }

    [Theory]
    [InlineData("rate.value")]
    [InlineData("horizon")]
    [InlineData("elements")]
    public void Missing_top_level_fields_are_named(string field)
    {
        var spec = Spec();
        spec = field switch
        {
            "rate.value" => spec with { Rate = null },
            "horizon" => spec with { Horizon = null },
            _ => spec with { Elements = null },
        };
        var outcome = Evaluator.Evaluate(spec);
        Assert.Equal(field, Assert.Single(outcome.Errors).Field);
    }

    [Fact]
    public void Nominal_rate_without_compoundings_is_named() =>
        Assert.Equal("rate.compoundingsPerYear", Assert.Single(Evaluator.Evaluate(Spec(0.1, RateBasis.Nominal)).Errors).Field);

    [Theory]
    [InlineData(ElementKind.Single, "period")]
    [InlineData(ElementKind.Uniform, "first")]
    [InlineData(ElementKind.Arithmetic, "step")]
    [InlineData(ElementKind.Geometric, "growth")]
    [InlineData(ElementKind.Recurring, "every")]
    public void Missing_element_fields_are_named_by_type(ElementKind kind, string field)
    {
        var full = new ElementSpec { Type = kind, Label = "x", Category = CashFlowCategory.Operating, Period = 1, First = 1, Last = 5, Every = 2, Amount = -10, Step = 1, Growth = 0.02 };
        ElementSpec missing = field switch
        {
            "period" => full with { Period = null },
            "first" => full with { First = null },
            "step" => full with { Step = null },
            "growth" => full with { Growth = null },
            _ => full with { Every = null },
        };
        var outcome = Evaluator.Evaluate(Spec(elements: [missing]));
        Assert.Equal($"elements[0].{field}", Assert.Single(outcome.Errors).Field);
        Assert.True(Evaluator.Evaluate(Spec(elements: [full])).IsValid);
    }

    [Fact]
    public void Missing_type_category_and_element_are_named()
    {
        var outcome = Evaluator.Evaluate(Spec() with
        {
            Elements =
            [
                new ElementSpec { Label = "x", Category = CashFlowCategory.Capital, Amount = 1 },
                new ElementSpec { Type = ElementKind.Single, Label = "y", Period = 0, Amount = 1 },
                null,
            ],
        });
        Assert.Equal(["elements[0].type", "elements[1].category", "elements[2]"], outcome.Errors.Select(e => e.Field));
    }

    [Fact]
    public void Rate_and_element_errors_are_reported_together()
    {
        var outcome = Evaluator.Evaluate(Spec(double.NaN, elements:
        [
            new ElementSpec { Type = ElementKind.Uniform, Label = "x", Category = CashFlowCategory.Capital, First = 1, Amount = 1 },
        ]));
        Assert.Equal(["rate.value", "elements[0].last"], outcome.Errors.Select(e => e.Field));
    }
}
