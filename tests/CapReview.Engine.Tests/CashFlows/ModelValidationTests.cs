using CapReview.Engine.CashFlows;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.CashFlows;

/// <summary>Every validation error of a model, each naming its field.</summary>
public class ModelValidationTests
{
    private static readonly CashFlowElement Ok = new SingleAmount("First cost", Capital, 0, -1000);

    private static string OnlyError(int horizon, int periodsPerYear, params CashFlowElement[] elements)
    {
        var outcome = CashFlowModel.Create(horizon, periodsPerYear, elements);
        Assert.False(outcome.IsValid);
        Assert.Null(outcome.Value);
        var error = Assert.Single(outcome.Errors);
        Assert.False(string.IsNullOrWhiteSpace(error.Message));
        return error.Field;
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-3)]
    [InlineData(1201)]
    public void Horizon_outside_1_to_1200(int horizon) => Assert.Equal("horizon", OnlyError(horizon, 1, Ok));

    [Theory]
    [InlineData(0)]
    [InlineData(366)]
    public void Periods_per_year_outside_1_to_365(int p) => Assert.Equal("periodsPerYear", OnlyError(10, p, Ok));

    [Fact]
    public void Empty_model() => Assert.Equal("elements", OnlyError(10, 1));

    [Fact]
    public void Too_many_elements() =>
        Assert.Equal("elements", OnlyError(10, 1, Enumerable.Repeat(Ok, CashFlowModel.MaxElements + 1).ToArray()));

    [Fact]
    public void Missing_element() => Assert.Equal("elements[1]", OnlyError(10, 1, Ok, null!));

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    public void Blank_label(string label) => Assert.Equal("elements[0].label", OnlyError(10, 1, new SingleAmount(label, Capital, 0, 1)));

    [Fact]
    public void Overlong_label() => Assert.Equal("elements[0].label", OnlyError(10, 1, new SingleAmount(new string('x', 121), Capital, 0, 1)));

    [Fact]
    public void Unknown_category() => Assert.Equal("elements[0].category", OnlyError(10, 1, new SingleAmount("x", (CashFlowCategory)9, 0, 1)));

    [Theory]
    [InlineData(-1)]
    [InlineData(11)]
    public void Single_amount_period_outside_the_horizon(int period) =>
        Assert.Equal("elements[1].period", OnlyError(10, 1, Ok, new SingleAmount("x", Capital, period, 1)));

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    [InlineData(2e12)]
    public void Amount_not_finite_or_too_large(double amount) =>
        Assert.Equal("elements[0].amount", OnlyError(10, 1, new UniformSeries("x", Operating, 1, 10, amount)));

    [Fact]
    public void Negative_first_period() => Assert.Equal("elements[0].first", OnlyError(10, 1, new UniformSeries("x", Operating, -1, 5, 1)));

    [Fact]
    public void First_period_after_the_horizon()
    {
        var outcome = CashFlowModel.Create(10, 1, [new RecurringAmount("x", Capital, 11, 12, 1, 1)]);
        Assert.Equal(["elements[0].first", "elements[0].last"], outcome.Errors.Select(e => e.Field));
    }

    [Fact]
    public void Periods_out_of_order() => Assert.Equal("elements[0].last", OnlyError(10, 1, new UniformSeries("x", Operating, 5, 4, 1)));

    [Fact]
    public void Last_period_after_the_horizon() => Assert.Equal("elements[0].last", OnlyError(10, 1, new ArithmeticGradientSeries("x", Operating, 1, 11, 1, 1)));

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(-5e12)]
    public void Step_not_finite_or_too_large(double step) =>
        Assert.Equal("elements[0].step", OnlyError(10, 1, new ArithmeticGradientSeries("x", Operating, 1, 10, 1, step)));

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(-1.0)]
    [InlineData(-1.2)]
    [InlineData(10.5)]
    public void Growth_at_or_below_minus_100_percent_or_above_1000(double growth) =>
        Assert.Equal("elements[0].growth", OnlyError(10, 1, new GeometricGradientSeries("x", Revenue, 1, 10, 1, growth)));

    [Theory]
    [InlineData(0)]
    [InlineData(-2)]
    [InlineData(1201)]
    public void Recurrence_interval_below_one_or_beyond_the_longest_horizon(int every) =>
        Assert.Equal("elements[0].every", OnlyError(10, 1, new RecurringAmount("x", Capital, 1, 10, every, 1)));

    [Fact]
    public void Geometric_series_that_outgrows_the_number_range_names_its_growth() =>
        Assert.Equal("elements[0].growth", OnlyError(1200, 1, new GeometricGradientSeries("x", Revenue, 1, 1200, 1e6, 10.0)));

    [Fact]
    public void Arithmetic_series_that_outgrows_the_flow_limit_names_its_step() =>
        Assert.Equal("elements[0].step", OnlyError(1200, 1, new ArithmeticGradientSeries("x", Revenue, 0, 1200, 1e12, 1e12)));

    [Fact]
    public void Every_problem_is_reported_at_once()
    {
        var outcome = CashFlowModel.Create(10, 1,
        [
            new SingleAmount("", Capital, 12, double.NaN),
            new UniformSeries("ok", Operating, 3, 2, 1),
        ]);
        Assert.Equal(["elements[0].label", "elements[0].period", "elements[0].amount", "elements[1].last"], outcome.Errors.Select(e => e.Field));
    }
}
