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
        draft.Parameters.Add(new ParameterDraft { Name = "MARR", Target = "rate", Low = "7", MostLikely = "9", High = "12" });
        draft.Correlations.Add(new CorrelationDraft { First = "Output", Second = "MARR", Coefficient = "-0.3" });
        var (spec, errors) = draft.Read(Irish);
        Assert.Empty(errors);
        var again = RiskDraft.From(spec, Irish).Read(Irish).Spec!;
        Assert.Equal(20_000, again.Trials);
        Assert.Equal(99, again.Seed);
        Assert.Equal(80_000, again.Parameters![0]!.MostLikely);
        // The MARR is typed in percent, as on the rest of the page, and stored as a fraction.
        Assert.Equal((0.07, 0.09, 0.12), (again.Parameters[1]!.Low!.Value, again.Parameters[1]!.MostLikely!.Value, again.Parameters[1]!.High!.Value), new Tolerance());
        Assert.Equal(DistributionKind.Pert, again.Parameters[0]!.Distribution);
        Assert.Equal(new Correlation("Output", "MARR", -0.3), again.Correlations!.Single());
        Assert.Null(new RiskDraft().Read(Irish).Spec);
    }

    [Fact]
    public void Scenarios_and_correlations_left_without_a_parameter_are_refused_not_dropped()
    {
        // Found by the editor's random walk: saving with every parameter removed silently lost the lead's scenarios.
        var draft = new RiskDraft();
        draft.Scenarios.Add(new ScenarioDraft { Name = "Market collapses" });
        draft.Correlations.Add(new CorrelationDraft { First = "Output", Second = "MARR", Coefficient = "0.4" });
        var (spec, errors) = draft.Read(Irish);
        Assert.Null(spec);
        Assert.Equal(["risk.correlations[0]", "risk.scenarios[0]"], errors.Select(e => e.Field));
        Assert.Equal("a scenario sets parameters' values: add a parameter, or remove the scenario.", errors[1].Message);
        Assert.Empty(new RiskDraft().Read(Irish).Errors);
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

    private sealed class Tolerance : IEqualityComparer<(double, double, double)>
    {
        public bool Equals((double, double, double) x, (double, double, double) y) =>
            Math.Abs(x.Item1 - y.Item1) < 1e-12 && Math.Abs(x.Item2 - y.Item2) < 1e-12 && Math.Abs(x.Item3 - y.Item3) < 1e-12;

        public int GetHashCode((double, double, double) obj) => 0;
    }

    [Fact]
    public void Every_rate_of_a_parameter_is_shown_and_typed_in_percent_and_other_inputs_as_they_are()
    {
        var stored = new Engine.Specifications.RiskSpec
        {
            Parameters =
            [
                new Engine.Specifications.ParameterSpec { Name = "Growth", Target = "elements[#e3].growth", Low = 0, MostLikely = 0.035, High = 0.07 },
                new Engine.Specifications.ParameterSpec { Name = "Tax", Target = "tax.incomeTaxRate", Low = 0.2, MostLikely = 0.25, High = 0.3 },
                new Engine.Specifications.ParameterSpec { Name = "Life", Target = "horizon", Low = 8, MostLikely = 10, High = 12 },
            ],
            Scenarios = [new Engine.Specifications.ScenarioSpec { Name = "Dear fuel", Values = new Dictionary<string, double> { ["Growth"] = 0.06 } }],
        };
        var draft = RiskDraft.From(stored, Irish);
        Assert.Equal(("0", "3.5", "7"), (draft.Parameters[0].Low, draft.Parameters[0].MostLikely, draft.Parameters[0].High));
        Assert.Equal(("20", "25", "30"), (draft.Parameters[1].Low, draft.Parameters[1].MostLikely, draft.Parameters[1].High));
        Assert.Equal(("8", "10", "12"), (draft.Parameters[2].Low, draft.Parameters[2].MostLikely, draft.Parameters[2].High));
        Assert.Equal("6", draft.Scenarios[0].Values["Growth"]);
        var read = draft.Read(Irish).Spec!;
        Assert.Equal(0.035, read.Parameters![0]!.MostLikely!.Value, 12);
        Assert.Equal(0.06, read.Scenarios![0]!.Values!["Growth"], 12);
        Assert.Equal(10, read.Parameters[2]!.MostLikely);
    }

    [Fact]
    public void A_value_that_is_not_a_number_is_named()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Output", Target = "elements[1].amount", Low = "sixty", MostLikely = "1", High = "2" });
        Assert.Equal("risk.parameters[0].low", draft.Read(Irish).Errors.Single().Field);
    }
}
