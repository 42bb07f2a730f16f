using CapReview.Reviews.Comments;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using Microsoft.Extensions.DependencyInjection;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class CommentAndCycleTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task The_lead_and_board_members_comment_and_others_who_see_it_read()
    {
        var cycle = await db.OpenCycleAsync("Comments 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        await db.Comments.AddAsync(Reviewer, draft.Id, "Is the electricity price escalated?", None);
        await db.Comments.AddAsync(Lead, draft.Id, "Not yet: flat 2027 tariff.", None);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Comments.AddAsync(Admin, draft.Id, "x", None));
        await Assert.ThrowsAsync<NotFoundException>(() => db.Comments.AddAsync(OtherLead, draft.Id, "x", None));
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Comments.AddAsync(Reviewer, draft.Id, "  ", None));
        var thread = await db.Comments.ListAsync(Admin, draft.Id, None);
        Assert.Equal(["Tove Board", "Oskar Lead"], thread.Select(c => c.AuthorName));
        Assert.All(thread, c => Assert.Equal(1, c.VersionNumber));
    }

    [Fact]
    public async Task A_cycle_in_review_takes_back_returned_proposals_but_no_new_ones()
    {
        var cycle = await db.OpenCycleAsync("Moves 2027");
        var first = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, first.Id, cycle.Id, first.Revision, None);
        var late = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Late"), None);

        var inReview = await db.Cycles.MoveAsync(Admin, cycle.Id, CycleStatus.InReview, cycle.Revision, None);
        Assert.Equal(CycleStatus.InReview, inReview.Status);
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.SubmitAsync(OtherLead, late.Id, cycle.Id, late.Revision, None));

        var returned = await db.Proposals.TransitionAsync(Reviewer, first.Id, ProposalStatus.ReturnedForChanges, submitted.Revision, None);
        var revised = await db.Proposals.UpdateDraftAsync(Lead, first.Id, returned.Revision, Draft(firstCost: -110_000, reason: "Cheaper supplier"), None);
        var back = await db.Proposals.SubmitAsync(Lead, first.Id, cycle.Id, revised.Revision, None);
        Assert.Equal(ProposalStatus.Submitted, back.Status);
        Assert.True(back.Versions.All(v => v.IsFrozen));

        await Assert.ThrowsAsync<RuleViolationException>(() => db.Cycles.MoveAsync(Admin, cycle.Id, CycleStatus.Decided, inReview.Revision, None));
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Cycles.MoveAsync(Reviewer, cycle.Id, CycleStatus.Closed, inReview.Revision, None));
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Cycles.MoveAsync(Admin, cycle.Id, CycleStatus.Closed, inReview.Revision, None));
    }
}
