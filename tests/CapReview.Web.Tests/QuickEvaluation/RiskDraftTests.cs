using System.Globalization;
using CapReview.Engine.Risk;
using CapReview.Web.ProposalForms;

namespace CapReview.Web.Tests.QuickEvaluation;

public class RiskDraftTests
{
    private static readonly CultureInfo Irish = CultureInfo.GetCultureInfo("en-IE");

    [Fact]
    public void Parameters_correlations_trials_and_seed_survive_a_round_trip()
    {
        var draft = new RiskDraft { Trials = "20,000", Seed = "99" };
        draft.Parameters.Add(new ParameterDraft { Name = "Output", Target = "elements[1].amount", Low = "60,000", MostLikely = "80,000", High = "95,000", Distribution = DistributionKind.Pert });
        draft.Parameters.Add(new ParameterDraft { Name = "MARR", Target = "rate", Low = "0.07", MostLikely = "0.09", High = "0.12" });
        draft.Correlations.Add(new CorrelationDraft { First = "Output", Second = "MARR", Coefficient = "-0.3" });
        var (spec, errors) = draft.Read(Irish);
        Assert.Empty(errors);
        var again = RiskDraft.From(spec, Irish).Read(Irish).Spec!;
        Assert.Equal(20_000, again.Trials);
        Assert.Equal(99, again.Seed);
        Assert.Equal(80_000, again.Parameters![0]!.MostLikely);
        Assert.Equal(DistributionKind.Pert, again.Parameters[0]!.Distribution);
        Assert.Equal(new Correlation("Output", "MARR", -0.3), again.Correlations!.Single());
        Assert.Null(new RiskDraft().Read(Irish).Spec);
    }

    [Fact]
    public void A_discrete_parameter_and_a_named_scenario_survive_a_round_trip_and_are_read_by_target()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Resale", Target = "elements[0].amount", Low = "0", MostLikely = "100", High = "300", Distribution = DistributionKind.Discrete, Outcomes = "0 : 0.2; 100 : 0.5; 300 : 0.3" });
        var scenario = new ScenarioDraft { Name = "Market collapses" };
        scenario.Values["Resale"] = "0";
        draft.Scenarios.Add(scenario);
        var (spec, errors) = draft.Read(Irish);
        Assert.Empty(errors);
        var again = RiskDraft.From(spec, Irish);
        Assert.Equal("0 : 0.2; 100 : 0.5; 300 : 0.3", again.Parameters[0].Outcomes);
        Assert.Equal("0", again.Scenarios[0].Values["Resale"]);
        var model = new Engine.Specifications.ModelSpec
        {
            Horizon = 1,
            Rate = new Engine.Specifications.RateSpec { Value = 0.1 },
            Elements = [new Engine.Specifications.ElementSpec { Type = Engine.Specifications.ElementKind.Single, Label = "Resale", Category = Engine.CashFlows.CashFlowCategory.Salvage, Period = 1, Amount = 100 }],
        };
        var settings = Engine.Specifications.RiskSpecReader.Read(spec!, new ProposalCase(model)).Value!;
        Assert.Equal(0, settings.Named.Single().Values["elements[0].amount"]);
        Assert.Equal(3, settings.Parameters[0].Outcomes!.Count);
    }

    [Fact]
    public void A_value_that_is_not_a_number_is_named()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Output", Target = "elements[1].amount", Low = "sixty", MostLikely = "1", High = "2" });
        Assert.Equal("risk.parameters[0].low", draft.Read(Irish).Errors.Single().Field);
    }
}
