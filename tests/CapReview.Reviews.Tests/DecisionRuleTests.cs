using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// The board's decisions against the board's own rules: capital limits of every budget year, exclusive and mandatory
/// groups, prerequisites; refused, or recorded with an override and its reason; changed until the cycle is signed off.
/// </summary>
public sealed class DecisionRuleTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private async Task<ProposalView> SubmittedAsync(BudgetCycle cycle, string title, double firstCost, double saving = 24_000)
    {
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(title: title, firstCost: firstCost, saving: saving), None);
        return await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
    }

    private Task<Decision> DecideAsync(ProposalView p, DecisionOutcome outcome, bool overriding = false, string? reason = null) =>
        db.Decisions.DecideAsync(Reviewer, new DecisionRequest(p.Id, outcome, "", p.BudgetCycleId, 1, null, overriding, reason), None);

    private async Task<IReadOnlyList<Decision>> DecisionsOfAsync(int proposalId)
    {
        await using var context = db.NewContext();
        return await context.Decisions.Where(d => d.ProposalId == proposalId).OrderBy(d => d.Id).ToListAsync();
    }

    [Fact]
    public async Task An_approval_beyond_the_capital_limit_is_refused_and_recorded_only_with_an_override_and_its_reason()
    {
        var cycle = await db.OpenCycleAsync("Limit 2027", capitalLimit: 200_000m);
        var press = await SubmittedAsync(cycle, "Press brake", -120_000);
        var saw = await SubmittedAsync(cycle, "Band saw", -100_000);
        await DecideAsync(press, DecisionOutcome.Approve);

        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(saw, DecisionOutcome.Approve));
        // 120,000 + 100,000 approved against the cycle's 200,000.
        Assert.Contains("capital limit of the cycle's budget year (220,000 approved against a limit of 200,000)", refused.Message, StringComparison.Ordinal);
        Assert.Empty(await DecisionsOfAsync(saw.Id));
        Assert.Equal(ProposalStatus.Submitted, (await db.Proposals.GetAsync(Reviewer, saw.Id, None)).Status);

        var noReason = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(saw, DecisionOutcome.Approve, overriding: true, reason: "  "));
        Assert.StartsWith("Reason for the override", noReason.Message, StringComparison.Ordinal);
        Assert.Empty(await DecisionsOfAsync(saw.Id));

        // The preview names the same rule before anything is recorded.
        var preview = await db.Decisions.PreviewAsync(Reviewer, new DecisionRequest(saw.Id, DecisionOutcome.Approve, "", cycle.Id, 1, null), None);
        Assert.Equal("year:0", Assert.Single(preview).Key);
        Assert.Empty(await DecisionsOfAsync(saw.Id));

        var recorded = await DecideAsync(saw, DecisionOutcome.Approve, overriding: true, reason: "The saw replaces a machine that failed its safety check");
        Assert.Equal("The saw replaces a machine that failed its safety check", recorded.OverrideReason);
        Assert.Contains("220,000 approved against a limit of 200,000", recorded.OverriddenRules, StringComparison.Ordinal);
        var stored = Assert.Single(await DecisionsOfAsync(saw.Id));
        Assert.Equal(recorded.OverrideReason, stored.OverrideReason);

        await using var context = db.NewContext();
        var audited = await context.AuditEvents.Where(e => e.Action == "decision.recorded" && e.EntityId == saw.Reference).SingleAsync();
        Assert.Contains("failed its safety check", audited.After, StringComparison.Ordinal);

        var standing = await db.Decisions.StandingAsync(Reviewer, cycle.Id, None);
        var year = Assert.Single(standing.Years);
        Assert.Equal((220_000.0, 200_000.0, true), (year.Approved, year.Limit, year.Over));
    }

    [Fact]
    public async Task A_later_budget_years_limit_counts_the_capital_spent_in_that_year()
    {
        var cycle = await db.OpenCycleAsync("Later years 2027", capitalLimit: 500_000m);
        cycle = await db.PortfolioRules.SetPlanAsync(Reviewer, cycle.Id, new CyclePlan(null, [10_000m], SelectionObjective.PresentWorth), cycle.Revision, None);
        var draft = Draft(title: "Kiln in two stages", firstCost: -80_000);
        draft = draft with
        {
            Assumptions = draft.Assumptions with
            {
                Model = draft.Assumptions.Model with
                {
                    Elements = [.. draft.Assumptions.Model.Elements!, new Engine.Specifications.ElementSpec
                    {
                        Type = Engine.Specifications.ElementKind.Single, Label = "Second stage", Category = Engine.CashFlows.CashFlowCategory.Capital, Period = 1, Amount = -30_000,
                    }],
                },
            },
        };
        var created = await db.Proposals.CreateDraftAsync(Lead, draft, None);
        var kiln = await db.Proposals.SubmitAsync(Lead, created.Id, cycle.Id, created.Revision, None);

        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(kiln, DecisionOutcome.Approve));
        // Year 0 holds 80,000 of 500,000; budget year 1 the second stage's 30,000 against its 10,000.
        Assert.Contains("budget year 1 (30,000 approved against a limit of 10,000)", refused.Message, StringComparison.Ordinal);
        Assert.DoesNotContain("cycle's budget year", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Groups_and_prerequisites_are_kept_left_open_or_broken_as_the_decisions_come_in()
    {
        var cycle = await db.OpenCycleAsync("Rules 2027");
        var a = await SubmittedAsync(cycle, "Spray booth A", -50_000);
        var b = await SubmittedAsync(cycle, "Spray booth B", -60_000);
        var c = await SubmittedAsync(cycle, "Boiler C", -40_000);
        var d = await SubmittedAsync(cycle, "Boiler D", -45_000);
        var e = await SubmittedAsync(cycle, "Extraction E", -20_000);
        var f = await SubmittedAsync(cycle, "Ducting F", -10_000);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Paint line", false, [a.Id, b.Id]), None);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Heating", true, [c.Id, d.Id]), None);
        await db.PortfolioRules.AddContingencyAsync(Reviewer, cycle.Id, e.Id, f.Id, None);

        await DecideAsync(a, DecisionOutcome.Approve);
        var two = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(b, DecisionOutcome.Approve));
        Assert.Contains($"At most one of Paint line ({a.Reference}, {b.Reference}) is approved (approved: {a.Reference}, {b.Reference})", two.Message, StringComparison.Ordinal);

        // One member of a mandatory group rejected: still open while the other is undecided; both rejected breaks it.
        await DecideAsync(c, DecisionOutcome.Reject);
        var none = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(d, DecisionOutcome.Reject));
        Assert.Contains($"Exactly one of Heating ({c.Reference}, {d.Reference}) is approved (none approved)", none.Message, StringComparison.Ordinal);

        // A dependent approved before its prerequisite is decided is open; rejecting the prerequisite breaks the rule.
        await DecideAsync(e, DecisionOutcome.Approve);
        var standing = await db.Decisions.StandingAsync(Reviewer, cycle.Id, None);
        Assert.Equal(
            [("group:Heating", RuleState.Open), ("group:Paint line", RuleState.Met), ($"needs:{e.Id}:{f.Id}", RuleState.Open)],
            standing.Rules.Select(r => (r.Key, r.State)));
        var prerequisite = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(f, DecisionOutcome.Reject));
        Assert.Contains($"{e.Reference} is approved only with its prerequisite {f.Reference} ({f.Reference} is rejected)", prerequisite.Message, StringComparison.Ordinal);

        await DecideAsync(d, DecisionOutcome.Approve);
        await DecideAsync(f, DecisionOutcome.Approve);
        standing = await db.Decisions.StandingAsync(Reviewer, cycle.Id, None);
        Assert.All(standing.Rules, r => Assert.Equal(RuleState.Met, r.State));
    }

    [Fact]
    public async Task A_changed_decision_supersedes_the_old_one_and_the_sign_offs_given_for_it_until_the_cycle_is_signed_off()
    {
        var cycle = await db.OpenCycleAsync("Change 2027");
        var pump = await SubmittedAsync(cycle, "Feed pump", -30_000);
        var first = await DecideAsync(pump, DecisionOutcome.Approve);
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);

        var same = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(pump, DecisionOutcome.Approve));
        Assert.Contains("already approved", same.Message, StringComparison.Ordinal);

        var second = await DecideAsync(pump, DecisionOutcome.Reject);
        Assert.Equal(ProposalStatus.Rejected, (await db.Proposals.GetAsync(Reviewer, pump.Id, None)).Status);
        var stored = await DecisionsOfAsync(pump.Id);
        Assert.Equal([(first.Id, DecisionOutcome.Approve), (second.Id, DecisionOutcome.Reject)], stored.Select(d => (d.Id, d.Outcome)));
        var listed = await db.Decisions.DecisionsAsync(Reviewer, cycle.Id, None);
        Assert.Equal([(int?)second.Id, null], listed.Select(d => d.SupersededBy));

        var signOffs = await db.Decisions.SignOffsAsync(Reviewer, cycle.Id, None);
        Assert.Empty(signOffs.Current);
        Assert.Equal([Reviewer.UserId], signOffs.Superseded.Select(s => s.UserId));
        Assert.Equal("Reject", Assert.Single(signOffs.Decisions).Outcome);

        await using (var context = db.NewContext())
        {
            var audited = await context.AuditEvents.Where(e => e.Action == "decision.recorded" && e.EntityId == pump.Reference).OrderBy(e => e.Id).ToListAsync();
            Assert.Equal(2, audited.Count);
            Assert.Contains($"\"supersedes\":{first.Id}", audited[1].After, StringComparison.Ordinal);
        }

        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        var late = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(pump, DecisionOutcome.Approve));
        Assert.Contains("already decided", late.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_approval_changed_to_a_return_goes_back_to_its_lead_superseded_and_audited_and_is_decided_again_once_resubmitted()
    {
        var cycle = await db.OpenCycleAsync("Change to return 2027", capitalLimit: 100_000m);
        var pump = await SubmittedAsync(cycle, "Feed pump", -30_000);
        var fan = await SubmittedAsync(cycle, "Extract fan", -80_000);
        var approval = await DecideAsync(pump, DecisionOutcome.Approve);
        // 30,000 + 80,000 against the 100,000 limit: the fan fits only once the pump's approval is gone.
        var preview = await db.Decisions.PreviewAsync(Reviewer, new DecisionRequest(fan.Id, DecisionOutcome.Approve, "", cycle.Id, 1, null), None);
        Assert.Equal("year:0", Assert.Single(preview).Key);

        var returned = await db.Decisions.DecideAsync(SecondReviewer,
            new DecisionRequest(pump.Id, DecisionOutcome.ReturnForChanges, "Quote the spare impeller too", cycle.Id, 1, null), None);
        var lead = await db.Proposals.GetAsync(Lead, pump.Id, None);
        Assert.Equal(ProposalStatus.ReturnedForChanges, lead.Status);
        Assert.Equal([(approval.Id, DecisionOutcome.Approve), (returned.Id, DecisionOutcome.ReturnForChanges)], (await DecisionsOfAsync(pump.Id)).Select(d => (d.Id, d.Outcome)));
        // The lead reads the board's comment with the decision, as after a first return.
        var listed = await db.Decisions.DecisionsAsync(Lead, cycle.Id, None);
        Assert.Equal([(approval.Id, (int?)returned.Id, ""), (returned.Id, null, "Quote the spare impeller too")], listed.Select(d => (d.Id, d.SupersededBy, d.Conditions)));
        // And on the proposal itself: the return that sent it back, while it is back.
        Assert.Equal((returned.Id, "Quote the spare impeller too"), (await db.Decisions.ReturnOfAsync(Lead, pump.Id, None)) is { } back ? (back.Id, back.Conditions) : default);
        Assert.Null(await db.Decisions.ReturnOfAsync(Lead, fan.Id, None));
        await using (var context = db.NewContext())
        {
            var audited = await context.AuditEvents.Where(e => e.Action == "decision.recorded" && e.EntityId == pump.Reference).OrderBy(e => e.Id).ToListAsync();
            Assert.Equal(2, audited.Count);
            Assert.Contains("\"status\":\"Approved\"", audited[1].Before, StringComparison.Ordinal);
            Assert.Contains("\"status\":\"ReturnedForChanges\"", audited[1].After, StringComparison.Ordinal);
            Assert.Contains($"\"supersedes\":{approval.Id}", audited[1].After, StringComparison.Ordinal);
        }
        // The approved capital is judged again on the set the return leaves: nothing approved, so the fan fits.
        var standing = await db.Decisions.StandingAsync(Reviewer, cycle.Id, None);
        Assert.Equal(0.0, Assert.Single(standing.Years).Approved);
        Assert.Empty(await db.Decisions.PreviewAsync(Reviewer, new DecisionRequest(fan.Id, DecisionOutcome.Approve, "", cycle.Id, 1, null), None));
        // No sign-off can be given while the pump is with its lead.
        await DecideAsync(fan, DecisionOutcome.Approve);
        var open = await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.SignOffAsync(Reviewer, cycle.Id, None));
        Assert.Equal($"Decide every proposal first: {pump.Reference} still open.", open.Message);

        var again = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(pump, DecisionOutcome.Approve));
        Assert.Equal($"{pump.Reference} is returned for changes: the board decides it again once its lead resubmits it.", again.Message);

        // Revised and resubmitted: the board decides version 2; a decision on version 1 is a conflict.
        var revised = await db.Proposals.ReviseAsync(Lead, pump.Id, lead.Revision, Draft(title: "Feed pump", firstCost: -15_000).Assumptions, "Spare impeller quoted", None);
        var resubmitted = await db.Proposals.SubmitAsync(Lead, pump.Id, cycle.Id, revised.Revision, None);
        Assert.Equal(ProposalStatus.Submitted, resubmitted.Status);
        Assert.Null(await db.Decisions.ReturnOfAsync(Lead, pump.Id, None));
        await Assert.ThrowsAsync<ConcurrencyConflictException>(() => DecideAsync(pump, DecisionOutcome.Approve));
        var decidedAgain = await db.Decisions.DecideAsync(Reviewer, new DecisionRequest(pump.Id, DecisionOutcome.Approve, "", cycle.Id, 2, null), None);
        Assert.Equal((2, ProposalStatus.Approved), (decidedAgain.VersionNumber, (await db.Proposals.GetAsync(Reviewer, pump.Id, None)).Status));
        // 15,000 + 80,000 within the 100,000.
        Assert.Equal(95_000.0, Assert.Single((await db.Decisions.StandingAsync(Reviewer, cycle.Id, None)).Years).Approved);

        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        var late = await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.DecideAsync(Reviewer,
            new DecisionRequest(pump.Id, DecisionOutcome.ReturnForChanges, "", cycle.Id, 2, null), None));
        Assert.Equal("The cycle Change to return 2027 is already decided.", late.Message);
        Assert.Equal(3, (await DecisionsOfAsync(pump.Id)).Count);
    }

    [Fact]
    public async Task A_return_that_leaves_an_approved_dependent_without_its_prerequisite_is_refused_unless_overridden_with_a_reason()
    {
        var cycle = await db.OpenCycleAsync("Return and rules 2027");
        var extraction = await SubmittedAsync(cycle, "Extraction", -20_000);
        var ducting = await SubmittedAsync(cycle, "Ducting", -10_000);
        await db.PortfolioRules.AddContingencyAsync(Reviewer, cycle.Id, extraction.Id, ducting.Id, None);
        await DecideAsync(ducting, DecisionOutcome.Approve);
        await DecideAsync(extraction, DecisionOutcome.Approve);

        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => DecideAsync(ducting, DecisionOutcome.ReturnForChanges));
        Assert.Contains($"{extraction.Reference} is approved only with its prerequisite {ducting.Reference} ({ducting.Reference} is returned for changes)", refused.Message, StringComparison.Ordinal);
        Assert.Equal(ProposalStatus.Approved, (await db.Proposals.GetAsync(Reviewer, ducting.Id, None)).Status);
        Assert.Single(await DecisionsOfAsync(ducting.Id));

        var recorded = await DecideAsync(ducting, DecisionOutcome.ReturnForChanges, overriding: true, reason: "The ducting route changes; extraction goes ahead on the old ducts");
        Assert.Contains($"prerequisite {ducting.Reference}", recorded.OverriddenRules, StringComparison.Ordinal);
        Assert.Equal("The ducting route changes; extraction goes ahead on the old ducts", recorded.OverrideReason);
        Assert.Equal(ProposalStatus.ReturnedForChanges, (await db.Proposals.GetAsync(Reviewer, ducting.Id, None)).Status);
    }

    [Fact]
    public async Task The_selected_portfolio_names_the_rules_it_would_break_beside_earlier_approvals_and_is_approved_only_with_an_override()
    {
        var cycle = await db.OpenCycleAsync("Portfolio override 2027", capitalLimit: 250_000m);
        // At 8 % over 10 years (P/A = 6.7101, common practice, no source): A 41,042, B 34,202, C 1,302 present worth;
        // the selection is A and B (220,000), and C was approved on its own before.
        var a = await SubmittedAsync(cycle, "Compressor A", -120_000, saving: 24_000);
        var b = await SubmittedAsync(cycle, "Lighting B", -100_000, saving: 20_000);
        var c = await SubmittedAsync(cycle, "Conveyor C", -200_000, saving: 30_000);
        await DecideAsync(c, DecisionOutcome.Approve);
        var approvals = db.Get<PortfolioApprovalService>();

        var plan = await approvals.PlanAsync(Reviewer, cycle.Id, None);
        Assert.Equal([a.Id, b.Id], plan.Select(p => p.ProposalId).Order());
        var broken = Assert.Single(await approvals.RulesBrokenAsync(Reviewer, cycle.Id, plan, None));
        // 200,000 + 120,000 + 100,000 against 250,000.
        Assert.Contains("420,000 approved against a limit of 250,000", broken.Words, StringComparison.Ordinal);
        Assert.Empty(await DecisionsOfAsync(a.Id));

        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => approvals.ApproveAsync(Reviewer, cycle.Id, [a.Id, b.Id], false, null, None));
        Assert.Contains("420,000 approved against a limit of 250,000", refused.Message, StringComparison.Ordinal);
        await Assert.ThrowsAsync<RuleViolationException>(() => approvals.ApproveAsync(Reviewer, cycle.Id, [a.Id, b.Id], true, " ", None));
        Assert.Empty(await DecisionsOfAsync(a.Id));

        var recorded = await approvals.ApproveAsync(Reviewer, cycle.Id, [a.Id, b.Id], true, "The conveyor is funded from the plant's own budget", None);
        Assert.All(recorded, d => Assert.Equal(("The conveyor is funded from the plant's own budget", true), (d.OverrideReason, d.OverriddenRules.Contains("420,000", StringComparison.Ordinal))));
        await using (var context = db.NewContext())
        {
            var audited = await context.AuditEvents.Where(e => e.Action == "decision.recorded" && (e.EntityId == a.Reference || e.EntityId == b.Reference)).ToListAsync();
            Assert.Equal(2, audited.Count);
            // The audit's JSON escapes the apostrophe (\u0027).
            Assert.All(audited, e => Assert.Contains("The conveyor is funded from the plant\\u0027s own budget", e.After, StringComparison.Ordinal));
        }
        Assert.Empty(await approvals.PlanAsync(Reviewer, cycle.Id, None));
    }

    [Fact]
    public async Task The_selected_portfolio_is_approved_in_one_step_exactly_as_confirmed()
    {
        var cycle = await db.OpenCycleAsync("Portfolio approval 2027", capitalLimit: 250_000m);
        // At 8 % over 10 years (P/A = 6.7101, common practice, no source): A 41,042, B 34,202, C 1,302 present worth.
        var a = await SubmittedAsync(cycle, "Compressor A", -120_000, saving: 24_000);
        var b = await SubmittedAsync(cycle, "Lighting B", -100_000, saving: 20_000);
        var c = await SubmittedAsync(cycle, "Conveyor C", -200_000, saving: 30_000);
        var approvals = db.Get<PortfolioApprovalService>();

        var plan = await approvals.PlanAsync(Reviewer, cycle.Id, None);
        Assert.Equal([a.Id, b.Id], plan.Select(p => p.ProposalId).Order());
        Assert.Equal([100_000.0, 120_000.0], plan.Select(p => p.FirstCost).Order());

        await Assert.ThrowsAsync<ConcurrencyConflictException>(() => approvals.ApproveAsync(Reviewer, cycle.Id, [a.Id], false, null, None));
        Assert.Empty(await DecisionsOfAsync(a.Id));
        await Assert.ThrowsAsync<Common.AccessDeniedException>(() => approvals.ApproveAsync(Finance, cycle.Id, [a.Id, b.Id], false, null, None));

        var recorded = await approvals.ApproveAsync(Reviewer, cycle.Id, [b.Id, a.Id], false, null, None);
        Assert.Equal([a.Id, b.Id], recorded.Select(d => d.ProposalId).Order());
        Assert.All(recorded, d => Assert.Equal(DecisionOutcome.Approve, d.Outcome));
        Assert.Equal(ProposalStatus.Submitted, (await db.Proposals.GetAsync(Reviewer, c.Id, None)).Status);
        Assert.Empty(await approvals.PlanAsync(Reviewer, cycle.Id, None));
    }
}
