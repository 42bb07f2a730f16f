using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using CsCheck;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

public class ExclusiveChoiceTests
{
    private static Alternative Machine(string name, double firstCost, double saving, int life, double salvage = 0) =>
        new(name, Models.Valid(life, 1,
            new SingleAmount("First cost", Capital, 0, -firstCost),
            new UniformSeries("Saving", Revenue, 1, life, saving),
            new SingleAmount("Resale", Salvage, life, salvage)));

    [Fact]
    public void Unequal_lives_compare_by_annual_worth_and_the_increments_agree()
    {
        // Outside reference for the annual worths: Microsoft.VisualBasic.Financial.Pmt (capital recovery) and PV.
        var a = Machine("Refurbished press", 20_000, 7_000, 3);
        var b = Machine("New press", 45_000, 11_000, 6, salvage: 5_000);
        var decision = ExclusiveChoice.Decide([a, b], AnnualRate.Effective(0.10), mandatory: false);

        Close.Assert(7_000 - Financial.Pmt(0.10, 3, -20_000), decision.AnnualWorths["Refurbished press"], 1e-9);
        Close.Assert(11_000 - Financial.Pmt(0.10, 6, -45_000) + 5_000 * -Financial.Pmt(0.10, 6, 0, 1), decision.AnnualWorths["New press"], 1e-9);
        Assert.Equal(6, decision.CommonHorizon);
        // Over the six-year horizon the refurbished press is bought twice: PW = AW (P/A, 10%, 6), Financial.PV.
        Close.Assert(-Financial.PV(0.10, 6, decision.AnnualWorths["Refurbished press"]), decision.PresentWorths["Refurbished press"], 1e-9);
        Close.Assert(-Financial.PV(0.10, 6, decision.AnnualWorths["New press"]), decision.PresentWorths["New press"], 1e-9);
        Assert.Equal("New press", decision.BestByAnnualWorth);
        Assert.Equal("New press", decision.BestByIncrementalAnalysis);
        Assert.Equal(2, decision.Steps.Count);
        Assert.Equal((ExclusiveChoice.DoNothing, "Refurbished press", false), (decision.Steps[0].Defender, decision.Steps[0].Challenger, decision.Steps[0].ChallengerWins));
        Assert.Equal((ExclusiveChoice.DoNothing, "New press", true), (decision.Steps[1].Defender, decision.Steps[1].Challenger, decision.Steps[1].ChallengerWins));
    }

    [Fact]
    public void Do_nothing_wins_when_every_alternative_loses_money_unless_the_group_is_mandatory()
    {
        var a = Machine("A", 10_000, 1_000, 4);
        var b = Machine("B", 15_000, 2_000, 4);
        var optional = ExclusiveChoice.Decide([a, b], AnnualRate.Effective(0.08), mandatory: false);
        Assert.Equal(ExclusiveChoice.DoNothing, optional.BestByAnnualWorth);
        Assert.Equal(ExclusiveChoice.DoNothing, optional.BestByIncrementalAnalysis);
        var mandatory = ExclusiveChoice.Decide([a, b], AnnualRate.Effective(0.08), mandatory: true);
        Assert.Equal(mandatory.BestByAnnualWorth, mandatory.BestByIncrementalAnalysis);
        Assert.NotEqual(ExclusiveChoice.DoNothing, mandatory.BestByIncrementalAnalysis);
        Assert.Single(mandatory.Steps);
    }

    [Fact]
    public void An_incremental_step_reports_the_rate_of_return_of_the_extra_investment()
    {
        // Extra 10,000 now for 3,000 more a year over 5 years: the increment's rate is Financial.Rate(5, 3000, −10000).
        var a = Machine("Basic", 20_000, 6_000, 5);
        var b = Machine("Premium", 30_000, 9_000, 5);
        var decision = ExclusiveChoice.Decide([a, b], AnnualRate.Effective(0.10), mandatory: true);
        var step = Assert.Single(decision.Steps);
        Close.Assert(Financial.Rate(5, 3_000, -10_000), step.IncrementalRateOfReturn!.Value, 1e-9);
        Assert.Equal(10_000, step.ExtraFirstCost);
        Assert.True(step.ChallengerWins);
        Assert.True(step.IncrementalBenefitCost > 1);
    }

    [Fact]
    public void The_incremental_analysis_picks_the_annual_worth_choice_on_every_generated_group()
    {
        var alternative = Gen.Select(Gen.Double[1_000, 80_000], Gen.Double[0, 25_000], Gen.Int[1, 6], Gen.Double[0, 10_000], Gen.Double[-3_000, 3_000])
            .Select((cost, saving, life, salvage, upkeep) => (cost, saving, life, salvage, upkeep));
        Gen.Select(alternative.Array[1, 5], Gen.Double[0.0, 0.30], Gen.Bool).Sample((group, marr, mandatory) =>
        {
            var alternatives = group.Select((g, k) => new Alternative($"alt-{k}", Models.Valid(g.life, 1,
                new SingleAmount("First cost", Capital, 0, -g.cost),
                new UniformSeries("Saving", Revenue, 1, g.life, g.saving),
                new UniformSeries("Upkeep", Operating, 1, g.life, g.upkeep),
                new SingleAmount("Resale", Salvage, g.life, g.salvage)))).ToList();
            var decision = ExclusiveChoice.Decide(alternatives, AnnualRate.Effective(marr), mandatory);
            // Ties within rounding may go either way.
            var top = decision.AnnualWorths.Values.Append(mandatory ? double.NegativeInfinity : 0.0).OrderDescending().Take(2).ToArray();
            bool tie = top.Length == 2 && Math.Abs(top[0] - top[1]) < 1e-6 * Math.Max(1, Math.Abs(top[0]));
            return tie || decision.BestByIncrementalAnalysis == decision.BestByAnnualWorth;
        }, iter: 2000);
    }

    [Fact]
    public void Lives_without_a_common_multiple_in_range_are_refused()
    {
        var a = Machine("A", 1_000, 500, 37);
        var b = Machine("B", 1_000, 500, 41);
        Assert.Throws<ArgumentException>(() => ExclusiveChoice.Decide([a, b], AnnualRate.Effective(0.1), false));
        Assert.Equal(12, CommonHorizon.LeastCommonMultiple([3, 4, 6]));
        Assert.Equal([-10, 5, -5, 5, 5], CommonHorizon.Repeat([-10, 5, 5], 4));
    }
}
