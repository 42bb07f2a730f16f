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
    public void A_value_that_is_not_a_number_is_named()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Output", Target = "elements[1].amount", Low = "sixty", MostLikely = "1", High = "2" });
        Assert.Equal("risk.parameters[0].low", draft.Read(Irish).Errors.Single().Field);
    }
}
