using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// The funded portfolio on alternatives of unequal lives: a mandatory need and an optional pair, each met by a
/// three-year and a six-year way, at the test policy's 8 %. Present worth over each way's own life would fund the
/// three-year need and the six-year pair member; the groups' incremental analysis picks the other two.
/// </summary>
public sealed class PortfolioUnequalLivesTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private static ProposalDraft Way(string title, double firstCost, double yearly, CashFlowCategory category, int life, double? valueAtStudyEnd = null) => new(
        title,
        "One way of meeting the need.",
        ProposalCategory.Replacement,
        RiskClass.Standard,
        new ProposalAssumptions
        {
            ValueAtStudyEnd = valueAtStudyEnd,
            Model = new ModelSpec
            {
                Horizon = life,
                PeriodsPerYear = 1,
                Elements =
                [
                    new ElementSpec { Type = ElementKind.Single, Label = "Equipment", Category = CashFlowCategory.Capital, Period = 0, Amount = -firstCost },
                    new ElementSpec { Type = ElementKind.Uniform, Label = "Each year", Category = category, First = 1, Last = life, Amount = yearly },
                ],
            },
        },
        null);

    private async Task<(BudgetCycle Cycle, string S, string L, string A, string B)> CycleAsync(string name, int? studyPeriodYears = null)
    {
        var cycle = await db.OpenCycleAsync(name, 1_000_000m);
        async Task<ProposalView> SubmitAsync(ProposalDraft draft)
        {
            var created = await db.Proposals.CreateDraftAsync(Lead, draft, None);
            return await db.Proposals.SubmitAsync(Lead, created.Id, cycle.Id, created.Revision, None);
        }
        var s = await SubmitAsync(Way("Compressor, rebuilt", 30_000, -5_000, CashFlowCategory.Operating, 3));
        var l = await SubmitAsync(Way("Compressor, new", 50_000, -4_000, CashFlowCategory.Operating, 6));
        var a = await SubmitAsync(Way("Labeller, leased model", 40_000, 18_000, CashFlowCategory.Revenue, 3));
        var b = await SubmitAsync(Way("Labeller, heavy model", 70_000, 17_000, CashFlowCategory.Revenue, 6));
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Compressed air", true, [s.Id, l.Id]), None);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Labelling", false, [a.Id, b.Id]), None);
        if (studyPeriodYears is int years)
        {
            var (current, _) = await db.Cycles.GetAsync(cycle.Id, None);
            await db.PortfolioRules.SetPlanAsync(Admin, cycle.Id, new CyclePlan(years, [], SelectionObjective.PresentWorth), current.Revision, None);
        }
        return (cycle, s.Reference, l.Reference, a.Reference, b.Reference);
    }

    [Fact]
    public async Task The_selection_funds_the_alternatives_the_incremental_analysis_picks_on_their_chains_over_the_common_horizon()
    {
        var (cycle, s, l, a, b) = await CycleAsync("Unequal lives 2027");
        var result = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);

        // The ranking still states each proposal's present worth over its own life; hand-computed from the 8 % table
        // of an engineering-economy handbook (from memory): (P/A, 8%, 3) = 2.5771, (P/A, 8%, 6) = 4.6229.
        double Ranked(string reference) => result.Ranking.Rows.Single(r => r.Proposal.Reference == reference).Ranked.PresentWorth;
        Assert.Equal(-30_000 - 5_000 * 2.5771, Ranked(s), 0.5);
        Assert.Equal(-70_000 + 17_000 * 4.6229, Ranked(b), 1.0);

        // The selection compares the chains over six years: the three-year ways are bought twice, PW(life) (1 + (P/F, 8%, 3)),
        // (P/F, 8%, 3) = 0.7938 from the same table.
        double Worth(string reference) => result.Problem.Candidates.Single(c => c.Id == reference).Worth;
        Assert.Equal((-30_000 - 5_000 * 2.5771) * (1 + 0.7938), Worth(s), 3.0);   // −76,927.9
        Assert.Equal(-50_000 - 4_000 * 4.6229, Worth(l), 0.5);                     // −68,491.6
        Assert.Equal((-40_000 + 18_000 * 2.5771) * (1 + 0.7938), Worth(a), 1.0);   // 11,458.3
        Assert.Equal(-70_000 + 17_000 * 4.6229, Worth(b), 1.0);                    // 8,589.3

        Assert.True(result.Optimal.ProvenOptimal);
        Assert.Equal(new[] { a, l }.Order(StringComparer.Ordinal), result.Optimal.Chosen.Order(StringComparer.Ordinal));
        var picks = GroupAnalyses.Of(result.Ranking).Select(g => g.Decision!.BestByIncrementalAnalysis).Order(StringComparer.Ordinal);
        Assert.Equal(picks, result.Optimal.Chosen.Order(StringComparer.Ordinal));
        Assert.Contains("least common multiple of their lives", result.WorthBasis, StringComparison.Ordinal);

        // By annual worth, (A/P, 8%, 3) = 0.38803 and (A/P, 8%, 6) = 0.21632: the same two.
        var annual = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(Objective: SelectionObjective.AnnualWorth), None);
        Assert.Equal(new[] { a, l }.Order(StringComparer.Ordinal), annual.Optimal.Chosen.Order(StringComparer.Ordinal));
        Assert.Equal(-40_000 * 0.38803 + 18_000 + (-50_000 * 0.21632 - 4_000), annual.Optimal.TotalWorth, 1.0);
        Assert.StartsWith("annual worth over each proposal's own life", annual.WorthBasis, StringComparison.Ordinal);
    }

    [Fact]
    public async Task With_a_study_period_every_proposal_is_worth_its_present_worth_over_it_and_the_basis_says_so()
    {
        // Six years is two lives of the three-year ways and one of the six-year ways: the same chains as above.
        var (cycle, s, l, a, _) = await CycleAsync("Study period 2027", studyPeriodYears: 6);
        var result = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        Assert.Equal((-30_000 - 5_000 * 2.5771) * (1 + 0.7938), result.Problem.Candidates.Single(c => c.Id == s).Worth, 3.0);
        Assert.Equal(new[] { a, l }.Order(StringComparer.Ordinal), result.Optimal.Chosen.Order(StringComparer.Ordinal));
        Assert.Equal("present worth over the cycle's study period of 6 years, for every proposal; the alternatives of a group at the group's MARR, as its incremental analysis compares them", result.WorthBasis);
    }

    [Fact]
    public async Task With_a_study_period_that_cuts_a_life_the_group_analysis_compares_over_it_and_agrees_with_the_selection()
    {
        // A four-year study period: the three-year way is bought again at year 3 and valued at 20,000 a year later;
        // the six-year way is cut at year 4 at its stated market value of 30,000. Over the lives' common multiple the
        // three-year way is the better (annual worth 2,478.8 against 1,857.6), over the four years the six-year way.
        var cycle = await db.OpenCycleAsync("Study period cuts a life 2027", 1_000_000m);
        async Task<ProposalView> SubmitAsync(ProposalDraft draft)
        {
            var created = await db.Proposals.CreateDraftAsync(Lead, draft, None);
            return await db.Proposals.SubmitAsync(Lead, created.Id, cycle.Id, created.Revision, None);
        }
        var leased = await SubmitAsync(Way("Labeller, leased model", 40_000, 18_000, CashFlowCategory.Revenue, 3, valueAtStudyEnd: 20_000));
        var heavy = await SubmitAsync(Way("Labeller, heavy model", 70_000, 17_000, CashFlowCategory.Revenue, 6, valueAtStudyEnd: 30_000));
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Labelling", false, [leased.Id, heavy.Id]), None);
        string a = leased.Reference, b = heavy.Reference;
        var (current, _) = await db.Cycles.GetAsync(cycle.Id, None);
        await db.PortfolioRules.SetPlanAsync(Admin, cycle.Id, new CyclePlan(4, [], SelectionObjective.PresentWorth), current.Revision, None);

        var result = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        var analysis = Assert.Single(GroupAnalyses.Of(result.Ranking));
        var decision = analysis.Decision!;
        // The selection funds the six-year way, and the group's incremental analysis picks it too.
        Assert.Equal([b], result.Optimal.Chosen);
        Assert.Equal(b, decision.BestByIncrementalAnalysis);

        // Hand-computed from the 8 % table of an engineering-economy handbook (from memory, four decimals):
        // (P/A, 8%, 4) = 3.3121, (P/F, 8%, 3) = 0.7938, (P/F, 8%, 4) = 0.7350. Tolerances: half a unit of the
        // printed place times the amounts.
        double pwA = -40_000 + 18_000 * 3.3121 - 40_000 * 0.7938 + 20_000 * 0.7350;   // 2,565.8
        double pwB = -70_000 + 17_000 * 3.3121 + 30_000 * 0.7350;                     // 8,355.7
        Assert.Equal(4, decision.CommonHorizon);
        Assert.Equal(pwA, decision.PresentWorths[a], 4.0);
        Assert.Equal(pwB, decision.PresentWorths[b], 2.5);
        var step = decision.Steps.Single(s => s.Challenger == b);
        Assert.Equal(a, step.Defender);
        Assert.Equal(pwB - pwA, step.IncrementalPresentWorth, 6.5);                    // 5,789.9
        Assert.True(step.ChallengerWins);
        Assert.Equal(b, decision.BestByAnnualWorth);
        Assert.Contains("study period of 4 years", decision.Basis, StringComparison.Ordinal);

        // Exactly the ranking's figures over the study period (one MARR here), and the selection's.
        foreach (var row in result.Ranking.Rows)
        {
            string reference = row.Proposal.Reference;
            Assert.Equal(row.Ranked.PresentWorth, decision.PresentWorths[reference], 1e-6);
            Assert.Equal(row.Ranked.AnnualWorth, decision.AnnualWorths[reference], 1e-6);
            Assert.Equal(row.Ranked.PresentWorth, result.Problem.Candidates.Single(c => c.Id == reference).Worth, 1e-6);
        }
        var annual = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(Objective: SelectionObjective.AnnualWorth), None);
        Assert.Equal([b], annual.Optimal.Chosen);
    }

    [Fact]
    public async Task A_group_whose_lives_have_no_common_multiple_in_range_keeps_its_own_lives_worths_and_the_basis_says_so()
    {
        var cycle = await db.OpenCycleAsync("No common horizon 2027", 1_000_000m);
        async Task<ProposalView> SubmitAsync(ProposalDraft draft)
        {
            var created = await db.Proposals.CreateDraftAsync(Lead, draft, None);
            return await db.Proposals.SubmitAsync(Lead, created.Id, cycle.Id, created.Revision, None);
        }
        // 37 and 41 years: their least common multiple, 1,517 years, is past the 1,200 periods the analysis covers.
        var first = await SubmitAsync(Way("Culvert, concrete", 90_000, 9_000, CashFlowCategory.Revenue, 37));
        var second = await SubmitAsync(Way("Culvert, steel", 80_000, 8_500, CashFlowCategory.Revenue, 41));
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Culvert", false, [first.Id, second.Id]), None);
        var result = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        foreach (var row in result.Ranking.Rows)
        {
            Assert.Equal(row.Ranked.PresentWorth, result.Problem.Candidates.Single(c => c.Id == row.Proposal.Reference).Worth);
        }
        Assert.EndsWith("; the proposals of Culvert keep their worth over their own lives (the lives have no common multiple within 1,200 periods: compare over a study period instead)",
            result.WorthBasis, StringComparison.Ordinal);
    }
}
