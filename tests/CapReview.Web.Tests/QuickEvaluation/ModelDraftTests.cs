using System.Globalization;
using CapReview.Engine.Specifications;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Tests.QuickEvaluation;

public class ModelDraftTests
{
    private static readonly CultureInfo Irish = CultureInfo.GetCultureInfo("en-IE");

    [Fact]
    public void Reads_percentages_as_fractions_and_thousands_separators_as_typed()
    {
        var draft = new ModelDraft { MarrPercent = "7.5", Horizon = "10" };
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Geometric, Label = "x", First = "1", Last = "10", Amount = "12,500", GrowthPercent = "2.5" });
        var reading = draft.Read(Irish);
        Assert.Empty(reading.Errors);
        Assert.Equal(0.075, reading.Spec.Rate!.Value!.Value, 15);
        Assert.Equal(12500, reading.Spec.Elements![0]!.Amount);
        Assert.Equal(0.025, reading.Spec.Elements[0]!.Growth!.Value, 15);
        Assert.Null(reading.Spec.Elements[0]!.Step);
    }

    [Fact]
    public void Constant_money_escalation_and_general_inflation_survive_a_round_trip()
    {
        var spec = new ModelSpec
        {
            Horizon = 10,
            Inflation = new InflationSpec { Rate = 0.025, BaseYear = 1, RealMarr = true },
            Elements =
            [
                new ElementSpec { Type = ElementKind.Uniform, Label = "Energy", Category = Engine.CashFlows.CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 900, Money = Engine.Inflation.MoneyBasis.Constant, Escalation = 0.04 },
                new ElementSpec { Type = ElementKind.Single, Label = "Unit", Category = Engine.CashFlows.CashFlowCategory.Capital, Period = 0, Amount = -5_000 },
            ],
        };
        var read = ModelDraft.FromSpec(spec, Irish, 6).Read(Irish);
        Assert.Empty(read.Errors);
        Assert.Equal(0.025, read.Spec.Inflation!.Rate!.Value, 15);
        Assert.Equal(1, read.Spec.Inflation.BaseYear);
        Assert.True(read.Spec.Inflation.RealMarr);
        Assert.Equal(Engine.Inflation.MoneyBasis.Constant, read.Spec.Elements![0]!.Money);
        Assert.Equal(0.04, read.Spec.Elements[0]!.Escalation!.Value, 15);
        Assert.Null(read.Spec.Elements[1]!.Money);
        // Nothing typed about inflation stays nothing: the stored model, and its hash, do not change.
        Assert.Null(new ModelDraft { Horizon = "5" }.Read(Irish).Spec.Inflation);
    }

    [Fact]
    public void Accepts_a_typographic_minus_sign()
    {
        var draft = new ModelDraft();
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Single, Label = "x", Period = "0", Amount = "−400" });
        Assert.Equal(-400, draft.Read(Irish).Spec.Elements![0]!.Amount);
    }

    [Theory]
    [InlineData("", "Enter a whole number of periods.")]
    [InlineData("2.5", "“2.5” is not a whole number.")]
    public void Names_a_period_that_is_not_a_whole_number(string text, string message)
    {
        var draft = new ModelDraft();
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Uniform, Label = "x", First = text, Last = "3", Amount = "1" });
        var error = Assert.Single(draft.Read(Irish).Errors);
        Assert.Equal("elements[0].first", error.Field);
        Assert.Equal(message, error.Message);
    }

    [Fact]
    public void Moving_beyond_either_end_changes_nothing()
    {
        var draft = ExampleModel.HeatRecoveryRetrofit();
        string first = draft.Elements[0].Label;
        draft.Move(0, -1);
        draft.Move(4, 1);
        Assert.Equal(first, draft.Elements[0].Label);
    }

    [Theory]
    [InlineData("elements[2].amount", "Element 3, amount")]
    [InlineData("elements[0].last", "Element 1, last period")]
    [InlineData("elements[4]", "Element 5")]
    [InlineData("rate.value", "MARR")]
    [InlineData("horizon", "Horizon")]
    public void Field_paths_read_as_people_count(string field, string described) =>
        Assert.Equal(described, CapReview.Reviews.Display.FieldWording.Describe(field));
}
