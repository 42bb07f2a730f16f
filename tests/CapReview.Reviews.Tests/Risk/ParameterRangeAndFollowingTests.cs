using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Risk;

namespace CapReview.Reviews.Tests.Risk;

/// <summary>
/// A parameter's values must leave a model that can be evaluated, each refused at its own field; a parameter whose
/// most likely value is its input's value follows the model, any other is reported with its difference. The plant
/// costs 400,000 now and saves 70,000 a year in years 1 to 10 at a MARR of 10 %, growing 2 % a year.
/// </summary>
public sealed class ParameterRangeAndFollowingTests
{
    private static ModelSpec Plant(double saving = 70_000, int horizon = 10) => new()
    {
        Horizon = horizon,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Id = "plant", Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Id = "saving", Type = ElementKind.Geometric, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving, Growth = 0.02 },
        ],
    };

    private static RiskSpec One(string target, double low, double likely, double high) =>
        new() { Parameters = [new ParameterSpec { Name = "P", Target = target, Low = low, MostLikely = likely, High = high }] };

    [Fact]
    public void A_life_shorter_than_the_last_period_of_an_element_is_refused_at_the_low_value()
    {
        // The saving runs to year 10: a life of 8 years leaves it past the end of the study.
        var prepared = ProposalRisk.Prepare(new ProposalCase(Plant()), One("horizon", 8, 10, 12));

        var error = Assert.Single(prepared.Errors);
        Assert.Equal("risk.parameters[0].low", error.Field);
        Assert.StartsWith("Low: at 8 the model cannot be evaluated", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_last_period_past_the_life_is_refused_at_the_high_value()
    {
        var prepared = ProposalRisk.Prepare(new ProposalCase(Plant()), One("elements[#saving].last", 8, 10, 12));

        var error = Assert.Single(prepared.Errors);
        Assert.Equal("risk.parameters[0].high", error.Field);
        Assert.StartsWith("High: at 12 the model cannot be evaluated", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_life_and_a_last_period_inside_the_model_are_analysed()
    {
        var prepared = ProposalRisk.Prepare(new ProposalCase(Plant(horizon: 12)), One("elements[#saving].last", 8, 10, 12));

        Assert.True(prepared.IsValid);
        var bar = Assert.Single(ProposalRisk.Analyse(prepared.Value!).Tornado);
        Assert.True(double.IsFinite(bar.AtLow) && double.IsFinite(bar.AtHigh));
    }

    [Theory]
    [InlineData("rate", 9, 0.09)]
    [InlineData("inflation.rate", 2.5, 0.025)]
    [InlineData("tax.incomeTaxRate", 25, 0.25)]
    [InlineData("elements[#saving].growth", 3.5, 0.035)]
    [InlineData("elements[1].escalation", 7, 0.07)]
    [InlineData("elements[#saving].amount", 70_000, 70_000)]
    [InlineData("horizon", 10, 10)]
    public void Rates_are_typed_in_percent_and_stored_as_fractions(string target, double typed, double stored)
    {
        Assert.Equal(stored, RiskUnits.Stored(target, typed), 12);
        Assert.Equal(typed, RiskUnits.Entered(target, stored), 9);
    }

    [Fact]
    public void A_parameter_that_followed_its_element_moves_with_it_and_keeps_its_spread()
    {
        var risk = One("elements[#saving].amount", 60_000, 70_000, 85_000);

        var moved = ParameterFollowing.Follow(risk, new ProposalCase(Plant(70_000)), new ProposalCase(Plant(78_000)));

        var p = Assert.Single(moved.Parameters!)!;
        Assert.Equal((68_000.0, 78_000.0, 93_000.0), (p.Low!.Value, p.MostLikely!.Value, p.High!.Value));
    }

    [Fact]
    public void A_parameter_set_apart_from_its_element_stays_and_is_reported_with_its_difference()
    {
        var risk = One("elements[#saving].amount", 55_000, 65_000, 80_000);

        var moved = ParameterFollowing.Follow(risk, new ProposalCase(Plant(70_000)), new ProposalCase(Plant(78_000)));
        var study = ProposalRisk.Prepare(new ProposalCase(Plant(78_000)), moved).Value!;

        Assert.Same(risk.Parameters![0], moved.Parameters![0]);
        var drift = Assert.Single(study.Drifts);
        Assert.Equal((0, 78_000.0, -13_000.0), (drift.Index, drift.Current, drift.Difference));
    }

    [Fact]
    public void The_ranking_names_the_proposals_whose_simulation_centres_apart_from_the_model()
    {
        var apart = ProposalRisk.Prepare(new ProposalCase(Plant(78_000)), One("elements[#saving].amount", 55_000, 65_000, 80_000)).Value!;
        var following = ProposalRisk.Prepare(new ProposalCase(Plant()), One("elements[#saving].amount", 55_000, 70_000, 80_000)).Value!;

        var named = RankingRisk.ApartFromTheModel(new Dictionary<string, RiskStudy?> { ["P-1"] = apart, ["P-2"] = following, ["P-3"] = null });

        Assert.Equal(["P-1"], named);
    }

    [Fact]
    public void A_parameter_at_its_element_value_is_not_reported()
    {
        var study = ProposalRisk.Prepare(new ProposalCase(Plant()), One("elements[#saving].growth", 0, 0.02, 0.04)).Value!;

        Assert.Empty(study.Drifts);
    }
}
