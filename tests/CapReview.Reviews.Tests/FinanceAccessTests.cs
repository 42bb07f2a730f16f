using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// Finance sees a cycle's proposals only once the board has decided the cycle: not while it is open, not while it is in
/// review (not even a proposal the board has already approved), and then everywhere at once. Every read the pages, the
/// API and the downloads make goes through these services, so the rule is tested here once for all of them.
/// </summary>
public sealed class FinanceAccessTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task Finance_sees_a_cycles_proposals_ranking_portfolio_and_rules_only_once_the_cycle_is_decided()
    {
        var cycle = await db.OpenCycleAsync("Finance waits 2027");
        var one = await db.Proposals.CreateDraftAsync(Lead, Draft(title: "Kiln"), None);
        var two = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Dust extraction", firstCost: -80_000, saving: 15_000), None);
        var s1 = await db.Proposals.SubmitAsync(Lead, one.Id, cycle.Id, one.Revision, None);
        var s2 = await db.Proposals.SubmitAsync(OtherLead, two.Id, cycle.Id, two.Revision, None);
        await db.PortfolioRules.SaveGroupAsync(Reviewer, cycle.Id, new GroupDraft("Kiln hall", false, [one.Id, two.Id]), None);

        await AssertHiddenFromFinanceAsync(cycle.Id, "still open", one.Id, two.Id);
        // The board and administrators see it all the while.
        Assert.Equal(2, (await db.Rankings.RankAsync(Reviewer, cycle.Id, 0.0, None)).Rows.Count);
        Assert.Equal(2, (await db.Rankings.RankAsync(Admin, cycle.Id, 0.0, None)).Rows.Count);

        var inReview = await db.Cycles.MoveAsync(Admin, cycle.Id, CycleStatus.InReview, cycle.Revision, None);
        Assert.Equal(CycleStatus.InReview, inReview.Status);
        // One proposal approved and the other rejected, but not yet signed off: still not finance's to see.
        await db.Decisions.DecideAsync(Reviewer, one.Id, DecisionOutcome.Approve, "", s1.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, two.Id, DecisionOutcome.Reject, "", s2.Revision, None);
        await AssertHiddenFromFinanceAsync(cycle.Id, "still in review", one.Id, two.Id);

        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        Assert.Equal(CycleStatus.Decided, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);

        // Decided: the approved proposal is ranked (a rejected one is not), and both are finance's to read.
        var ranking = await db.Rankings.RankAsync(Finance, cycle.Id, 0.0, None);
        Assert.Equal([s1.Reference], ranking.Rows.Select(r => r.Proposal.Reference));
        var portfolio = await db.Portfolio.SelectAsync(Finance, cycle.Id, new PortfolioQuery(), None);
        Assert.Equal([s1.Reference], portfolio.Optimal.Chosen);
        Assert.Equal(["Kiln hall"], (await db.PortfolioRules.GetAsync(Finance, cycle.Id, None)).Groups.Select(g => g.Name));
        Assert.Equal(ProposalStatus.Approved, (await db.Proposals.GetAsync(Finance, one.Id, None)).Status);
        Assert.Equal(ProposalStatus.Rejected, (await db.Proposals.GetAsync(Finance, two.Id, None)).Status);
        Assert.Equal([s1.Reference, s2.Reference], (await db.Proposals.ListInCycleAsync(Finance, cycle.Id, None)).Select(p => p.Reference));
        Assert.Equal([s1.Reference, s2.Reference], (await db.Decisions.DecisionsAsync(Finance, cycle.Id, None)).Select(d => d.Reference));
        Assert.Equal(2, (await db.Overviews.GetAsync(Finance, cycle.Id, None)).Rows.Count);
        Assert.Empty(await db.Comments.ListAsync(Finance, one.Id, None));
        Assert.True(ProposalAccess.CanSeeProposalsOf(Finance, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id)));
    }

    /// <summary>Every read of the cycle's proposals refuses finance, the whole-cycle ones with the reason and the cycle's state.</summary>
    private async Task AssertHiddenFromFinanceAsync(int cycleId, string state, params int[] proposalIds)
    {
        var ranking = await Assert.ThrowsAsync<AccessDeniedException>(() => db.Rankings.RankAsync(Finance, cycleId, 0.0, None));
        Assert.Equal($"Finance sees the ranking and portfolio of the cycle Finance waits 2027 once the board has decided it; it is {state}.", ranking.Message);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Rankings.LoadAsync(Finance, cycleId, None));
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Portfolio.SelectAsync(Finance, cycleId, new PortfolioQuery(), None));
        var rules = await Assert.ThrowsAsync<AccessDeniedException>(() => db.PortfolioRules.GetAsync(Finance, cycleId, None));
        Assert.Equal($"Finance sees the portfolio rules of the cycle Finance waits 2027 once the board has decided it; it is {state}.", rules.Message);
        Assert.Empty(await db.Proposals.ListInCycleAsync(Finance, cycleId, None));
        Assert.Empty(await db.Decisions.DecisionsAsync(Finance, cycleId, None));
        Assert.Empty((await db.Overviews.GetAsync(Finance, cycleId, None)).Rows);
        foreach (int id in proposalIds)
        {
            await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.GetAsync(Finance, id, None));
            await Assert.ThrowsAsync<NotFoundException>(() => db.Comments.ListAsync(Finance, id, None));
        }
    }
}
