using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests.Proposals;

/// <summary>
/// Issue 17: a lead revises a proposal the board has while its cycle is undecided; the board sees the revision pending,
/// and resubmitting it replaces the version under review, with the decision on the old version standing for nothing.
/// </summary>
public sealed class RevisionUnderReviewTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_revision_is_pending_beside_the_version_under_review_and_the_board_sees_it()
    {
        var cycle = await db.OpenCycleAsync($"Pending {Guid.NewGuid():N}");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        var inReview = await db.Proposals.TransitionAsync(Reviewer, draft.Id, ProposalStatus.InReview, submitted.Revision, None);

        var revised = await db.Proposals.ReviseAsync(Lead, draft.Id, inReview.Revision, Draft(firstCost: -150_000).Assumptions, "Supplier quote came in higher", None);

        Assert.Equal(ProposalStatus.InReview, revised.Status);
        Assert.Equal(2, revised.PendingRevision?.Number);
        Assert.Equal(1, revised.UnderReview?.Number);
        var row = (await db.Overviews.GetAsync(Reviewer, cycle.Id, None)).Rows.Single(r => r.Proposal.Id == draft.Id);
        Assert.Equal(1, row.VersionNumber);
        Assert.Equal(2, row.Proposal.PendingRevision?.Number);
        // Figures the board reads stay those of version 1: -120,000 first cost plus 24,000 a year for 10 years at 8 %.
        // Outside reference: 24,000 × (1 − 1.08^−10) / 0.08 = 161,041.95 (uniform-series present-worth factor 6.710081, published tables).
        Assert.Equal(-120_000 + 161_041.95, row.Evaluation!.PresentWorth, 1);
        // Deciding it now decides version 1, the one under review.
        var decision = await db.Decisions.DecideAsync(Reviewer, new DecisionRequest(draft.Id, DecisionOutcome.Approve, "", cycle.Id, 1, revised.Revision), None);
        Assert.Equal(1, decision.VersionNumber);

        await using var context = db.NewContext();
        var actions = await context.AuditEvents.Where(e => e.EntityId == draft.Reference).OrderBy(e => e.Id).Select(e => e.Action).ToListAsync();
        Assert.Equal(["proposal.created", "proposal.submitted", "proposal.inreview", "proposal.revision-started", "decision.recorded"], actions);
    }

    [Fact]
    public async Task Resubmitting_after_a_decision_leaves_that_decision_in_the_record_but_standing_for_nothing_and_supersedes_the_sign_offs()
    {
        var cycle = await db.OpenCycleAsync($"Resubmit {Guid.NewGuid():N}");
        var one = await db.Proposals.CreateDraftAsync(Lead, Draft(title: "Paint line chiller"), None);
        var two = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Dock levellers"), None);
        var s1 = await db.Proposals.SubmitAsync(Lead, one.Id, cycle.Id, one.Revision, None);
        var s2 = await db.Proposals.SubmitAsync(OtherLead, two.Id, cycle.Id, two.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, one.Id, DecisionOutcome.Approve, "Order in March", s1.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, two.Id, DecisionOutcome.Reject, "", s2.Revision, None);
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);

        var approved = await db.Proposals.GetAsync(Lead, one.Id, None);
        var revised = await db.Proposals.ReviseAsync(Lead, one.Id, approved.Revision, Draft(title: "Paint line chiller", firstCost: -150_000).Assumptions, "Quote went up", None);
        // Pending only: the approval and the sign-off still stand for version 1.
        Assert.Equal(ProposalStatus.Approved, revised.Status);
        Assert.Equal([Reviewer.UserId], (await db.Decisions.SignOffsAsync(Reviewer, cycle.Id, None)).Current.Select(s => s.UserId));

        var resubmitted = await db.Proposals.SubmitAsync(Lead, one.Id, cycle.Id, revised.Revision, None);

        Assert.Equal(ProposalStatus.Submitted, resubmitted.Status);
        Assert.Null(resubmitted.PendingRevision);
        Assert.Equal(2, resubmitted.UnderReview?.Number);
        var signOffs = await db.Decisions.SignOffsAsync(Reviewer, cycle.Id, None);
        Assert.Empty(signOffs.Current);
        Assert.Equal([Reviewer.UserId], signOffs.Superseded.Select(s => s.UserId));
        // The set a sign-off would cover holds only the other proposal's decision: version 1's approval counts for nothing.
        Assert.Equal([two.Reference], signOffs.Decisions.Select(d => d.Proposal));
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None));
        Assert.Equal($"Decide every proposal first: {one.Reference} still open.", refused.Message);
        // Kept in the record, as written.
        var decisions = await db.Decisions.DecisionsAsync(Reviewer, cycle.Id, None);
        Assert.Equal(1, decisions.Single(d => d.Reference == one.Reference).VersionNumber);
        // A member who judged version 1 cannot record that judgement on version 2.
        await Assert.ThrowsAsync<ConcurrencyConflictException>(() => db.Decisions.DecideAsync(SecondReviewer,
            new DecisionRequest(one.Id, DecisionOutcome.Approve, "", cycle.Id, 1, resubmitted.Revision), None));

        await using (var context = db.NewContext())
        {
            var audit = await context.AuditEvents.Where(e => e.EntityId == one.Reference).OrderBy(e => e.Id).LastAsync();
            Assert.Equal("proposal.resubmitted", audit.Action);
            Assert.Contains("\"replacesVersion\":1", audit.After, StringComparison.Ordinal);
            Assert.Contains("\"outcome\":\"Approve\"", audit.After, StringComparison.Ordinal);
        }

        var fresh = await db.Decisions.DecideAsync(SecondReviewer, new DecisionRequest(one.Id, DecisionOutcome.Approve, "", cycle.Id, 2, resubmitted.Revision), None);
        Assert.Equal(2, fresh.VersionNumber);
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        Assert.Equal(CycleStatus.Decided, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);
        var record = await db.Records.ForCycleAsync(cycle.Id, None);
        Assert.All(record.SignOffs, s => Assert.Contains($"\"Proposal\":\"{one.Reference}\",\"Version\":2", s.DecisionsSigned, StringComparison.Ordinal));
    }

    [Fact]
    public async Task Once_the_cycle_is_decided_the_lead_can_no_longer_revise()
    {
        var cycle = await db.OpenCycleAsync($"Closed to revisions {Guid.NewGuid():N}");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, draft.Id, DecisionOutcome.Approve, "", submitted.Revision, None);
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        var decided = await db.Proposals.GetAsync(Lead, draft.Id, None);

        var error = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Proposals.ReviseAsync(Lead, draft.Id, decided.Revision, Draft(firstCost: -150_000).Assumptions, "Too late", None));
        Assert.Equal("A proposal that is approved in a decided cycle cannot be edited.", error.Message);
        Assert.Single((await db.Proposals.GetAsync(Lead, draft.Id, None)).Versions);
    }
}
