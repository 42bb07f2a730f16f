using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using Microsoft.VisualBasic;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class PortfolioTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    // Four invented ten-year proposals at the test policy's 8%: two ways of meeting one need (A, B), and D needs C.
    private async Task<(BudgetCycle Cycle, ProposalView A, ProposalView B, ProposalView C, ProposalView D)> CycleOfFourAsync(string name, decimal limit)
    {
        var cycle = await db.OpenCycleAsync(name, limit);
        async Task<ProposalView> SubmitAsync(string title, double cost, double saving)
        {
            var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(title, -cost, saving: saving), None);
            return await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        }
        var a = await SubmitAsync("Line A", 120_000, 24_000);
        var b = await SubmitAsync("Line B", 150_000, 30_000);
        var c = await SubmitAsync("Robot cell", 60_000, 12_000);
        var d = await SubmitAsync("Cell software", 30_000, 5_000);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Paint line", false, [a.Id, b.Id]), None);
        await db.PortfolioRules.AddContingencyAsync(Reviewer, cycle.Id, d.Id, c.Id, None);
        return (cycle, a, b, c, d);
    }

    private static double PresentWorth(double cost, double saving) => -cost - Financial.PV(0.08, 10, saving);

    [Fact]
    public async Task The_ranking_orders_by_annual_worth_with_each_measure_and_shows_the_rules()
    {
        var (cycle, a, b, c, d) = await CycleOfFourAsync("Ranking 2027", 2_000_000m);
        var ranking = await db.Rankings.RankAsync(Admin, cycle.Id, 0.0, None);
        Assert.Equal([b.Reference, a.Reference, c.Reference, d.Reference], ranking.Rows.Select(r => r.Proposal.Reference));
        var top = ranking.Rows[0];
        // Outside reference: Microsoft.VisualBasic.Financial.PV and Pmt at 8% over ten years.
        Assert.Equal(PresentWorth(150_000, 30_000), top.Ranked.PresentWorth, 6);
        Assert.Equal(Financial.Pmt(0.08, 10, -PresentWorth(150_000, 30_000)), top.Ranked.AnnualWorth, 6);
        double[] flows = Flows(150_000, 30_000);
        Assert.Equal(Financial.IRR(ref flows), top.Ranked.Evaluation.UniqueRateOfReturn!.Value, 9);
        Assert.Equal("Paint line", top.Group?.Name);
        Assert.Equal([c.Reference], ranking.Rows.Single(r => r.Proposal.Id == d.Id).Prerequisites);
        Assert.Equal(1, top.Version.Number);
        Assert.Contains("repeatability", ranking.Basis);

        var higher = await db.Rankings.RankAsync(Reviewer, cycle.Id, 0.02, None);
        Assert.Equal(0.10, higher.Rows[0].Marr.EffectiveAnnual(), 12);
        Assert.Equal(Financial.Pmt(0.10, 10, -(-150_000 - Financial.PV(0.10, 10, 30_000))), higher.Rows[0].Ranked.AnnualWorth, 6);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Rankings.RankAsync(Lead, cycle.Id, 0.0, None));
    }

    private static double[] Flows(double cost, double saving) => [-cost, .. Enumerable.Repeat(saving, 10)];

    [Fact]
    public async Task The_optimal_portfolio_respects_the_group_and_the_contingency_and_beats_the_greedy_fill()
    {
        var (cycle, a, b, c, d) = await CycleOfFourAsync("Portfolio 2027", 200_000m);
        var result = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        // Hand-checked: B alone (150,000) or A with C (180,000) fit; A + C is worth more. The greedy fill takes B first.
        Assert.True(result.Optimal.ProvenOptimal);
        Assert.Equal([a.Reference, c.Reference], result.Optimal.Chosen.Order());
        Assert.Equal(PresentWorth(120_000, 24_000) + PresentWorth(60_000, 12_000), result.Optimal.TotalWorth, 6);
        Assert.Equal([b.Reference], result.Greedy.Chosen);
        Assert.Equal(result.Optimal.TotalWorth - PresentWorth(150_000, 30_000), result.Advantage, 6);
        var worths = result.Frontier.Select(f => f.Selection.TotalWorth).ToList();
        Assert.Equal(worths.Order(), worths);
        Assert.Contains(result.Frontier, f => f.Limit == 200_000);

        var wider = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(CapitalLimit: 1_000_000m), None);
        Assert.Equal([b.Reference, c.Reference, d.Reference], wider.Optimal.Chosen.Order());
        var byAnnualWorth = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(Objective: SelectionObjective.AnnualWorth), None);
        Assert.Equal(Financial.Pmt(0.08, 10, -result.Optimal.TotalWorth), byAnnualWorth.Optimal.TotalWorth, 6);
    }

    [Fact]
    public async Task A_dependent_whose_prerequisite_is_withdrawn_is_left_out_with_the_reason()
    {
        var (cycle, _, _, c, d) = await CycleOfFourAsync("Withdrawn 2027", 2_000_000m);
        await db.Proposals.TransitionAsync(Lead, c.Id, ProposalStatus.Withdrawn, (await db.Proposals.GetAsync(Lead, c.Id, None)).Revision, None);
        var result = await db.Portfolio.SelectAsync(Admin, cycle.Id, new PortfolioQuery(), None);
        Assert.DoesNotContain(result.Ranking.Rows, r => r.Proposal.Id == c.Id);
        Assert.Equal([(d.Reference, "its prerequisite is not in the ranking")], result.Excluded);
        Assert.DoesNotContain(d.Reference, result.Optimal.Chosen);
    }

    [Fact]
    public async Task The_rules_are_checked_named_by_field_and_audited()
    {
        var (cycle, a, b, c, d) = await CycleOfFourAsync("Rules 2027", 2_000_000m);
        var inTwo = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Cell", false, [b.Id, c.Id]), None));
        Assert.StartsWith("Proposals: a proposal can be in one group only", inTwo.Message);
        var excluding = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Cell", false, [c.Id, d.Id]), None));
        Assert.StartsWith("Proposals: a proposal and its prerequisite", excluding.Message);
        var circle = await Assert.ThrowsAsync<RuleViolationException>(() => db.PortfolioRules.AddContingencyAsync(Reviewer, cycle.Id, c.Id, d.Id, None));
        Assert.StartsWith("Prerequisite: the contingencies would go round", circle.Message);
        await Assert.ThrowsAsync<RuleViolationException>(() => db.PortfolioRules.AddContingencyAsync(Reviewer, cycle.Id, a.Id, b.Id, None));
        var alone = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Solo", false, [c.Id]), None));
        Assert.StartsWith("Proposals: a group of alternatives needs at least two", alone.Message);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.PortfolioRules.AddContingencyAsync(Finance, cycle.Id, a.Id, c.Id, None));
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.PortfolioRules.SaveGroupAsync(Lead, cycle.Id, new GroupDraft("X", true, [c.Id]), None));
        var negative = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.PortfolioRules.SetPlanAsync(Admin, cycle.Id, new CyclePlan(null, [100m, -1m], SelectionObjective.PresentWorth), cycle.Revision, None));
        Assert.StartsWith("Capital limit of budget year 2: the limit of budget year 2 cannot be negative.", negative.Message);
        Assert.Equal("laterYearLimits[1]", negative.Field);

        var rules = await db.PortfolioRules.GetAsync(cycle.Id, None);
        Assert.Equal(["Paint line"], rules.Groups.Select(g => g.Name));
        Assert.Single(rules.Contingencies);

        var planned = await db.PortfolioRules.SetPlanAsync(Reviewer, cycle.Id, new CyclePlan(8, [500_000m], SelectionObjective.AnnualWorth), cycle.Revision, None);
        Assert.Equal(8, planned.StudyPeriodYears);
        await Assert.ThrowsAsync<ConcurrencyConflictException>(() =>
            db.PortfolioRules.SetPlanAsync(Reviewer, cycle.Id, new CyclePlan(null, [], SelectionObjective.PresentWorth), cycle.Revision, None));
        var (stored, _) = await db.Cycles.GetAsync(cycle.Id, None);
        Assert.Equal([500_000m], stored.LaterYearLimits);
        Assert.Equal(SelectionObjective.AnnualWorth, stored.Objective);
        Assert.Contains("study period of 8 years", (await db.Rankings.RankAsync(Reviewer, cycle.Id, 0, None)).Basis);

        var group = rules.Groups.Single();
        await db.PortfolioRules.RemoveGroupAsync(Reviewer, cycle.Id, group.Id, None);
        await db.PortfolioRules.RemoveContingencyAsync(Reviewer, cycle.Id, rules.Contingencies[0].Id, None);
        Assert.Empty((await db.PortfolioRules.GetAsync(cycle.Id, None)).Groups);

        await using var context = db.NewContext();
        var actions = await context.AuditEvents.Where(e => e.EntityType == "budget_cycle" && e.EntityId == cycle.Id.ToString()).Select(e => e.Action).ToListAsync();
        Assert.Equal(["cycle.created", "cycle.group-saved", "cycle.contingency-added", "cycle.plan-changed", "cycle.group-removed", "cycle.contingency-removed"], actions);
    }

    [Fact]
    public async Task Replacement_estimates_are_stored_with_the_version_and_checked_by_field()
    {
        var estimates = new ReplacementEstimates(8_000, [new(6_000, 9_000), new(4_500, 12_000)], [new(90_000, 3_000)]);
        var plain = Draft();
        var draft = await db.Proposals.CreateDraftAsync(Lead, plain with { Assumptions = plain.Assumptions with { Replacement = estimates, ValueAtStudyEnd = 15_000 } }, None);
        var stored = draft.Latest.Assumptions;
        Assert.Equal(15_000, stored.ValueAtStudyEnd);
        Assert.Equal([6_000, 4_500], stored.Replacement!.Defender.Select(y => y.MarketValue));

        var bad = plain with { Assumptions = plain.Assumptions with { Replacement = estimates with { Defender = [new(6_000, 9_000), new(-1, 12_000)] } } };
        var error = await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, bad, None));
        Assert.Equal("Asset in service, year 2, market value: Year 2: the market value must be a number, zero or more.", error.Message);
        var none = plain with { Assumptions = plain.Assumptions with { Replacement = estimates with { Challenger = [] } } };
        Assert.StartsWith("Replacement, proposed asset:", (await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, none, None))).Message);
    }

    [Fact]
    public async Task A_group_is_chosen_at_the_highest_marr_of_its_members_and_both_methods_agree()
    {
        var cycle = await db.OpenCycleAsync("Groups 2027");
        var safe = await db.Proposals.CreateDraftAsync(Lead, Draft("Rebuild", -60_000, saving: 13_000), None);
        var boldDraft = Draft("New unit", -150_000, saving: 30_000);
        var own = new MarrOverride(new Engine.Specifications.RateSpec { Value = 0.12, Basis = Engine.Rates.RateBasis.Effective }, "Unproven technology");
        var bold = await db.Proposals.CreateDraftAsync(Lead, boldDraft with { Assumptions = boldDraft.Assumptions with { MarrOverride = own } }, None);
        await db.Proposals.SubmitAsync(Lead, safe.Id, cycle.Id, safe.Revision, None);
        await db.Proposals.SubmitAsync(Lead, bold.Id, cycle.Id, bold.Revision, None);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Unit", false, [safe.Id, bold.Id]), None);
        var ranking = await db.Rankings.RankAsync(Reviewer, cycle.Id, 0, None);

        var analysis = GroupAnalyses.Of(ranking).Single();
        // The rebuild is judged at the policy's 8%, the new unit at its own 12%: the group at the higher.
        Assert.Equal(0.12, analysis.Marr!.Value.EffectiveAnnual(), 12);
        Assert.StartsWith($"the highest MARR of its proposals ({bold.Reference}'s)", analysis.MarrNote);
        var decision = analysis.Decision!;
        Assert.Equal(decision.BestByAnnualWorth, decision.BestByIncrementalAnalysis);
        // Outside reference: Microsoft.VisualBasic.Financial.PV at 12% over ten years: 19,507 against 13,453.
        Assert.Equal(bold.Reference, decision.BestByAnnualWorth);
        Assert.Equal(-150_000 - Financial.PV(0.12, 10, 30_000), decision.PresentWorths[bold.Reference], 6);
        Assert.Equal(-60_000 - Financial.PV(0.12, 10, 13_000), decision.PresentWorths[safe.Reference], 6);
        Assert.Equal(2, decision.Steps.Count);

        // The selection weighs the group's members as its analysis does, at 12% (not the rebuild's own 8%).
        var portfolio = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        Assert.Equal(-60_000 - Financial.PV(0.12, 10, 13_000), portfolio.Problem.Candidates.Single(c => c.Id == safe.Reference).Worth, 6);
        Assert.Equal([bold.Reference], portfolio.Optimal.Chosen);
    }
}
