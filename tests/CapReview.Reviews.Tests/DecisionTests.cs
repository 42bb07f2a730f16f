using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class DecisionTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_decision_records_the_version_its_hash_and_the_cycles_marr()
    {
        var cycle = await db.OpenCycleAsync("Decide 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        var decision = await db.Decisions.DecideAsync(Reviewer, draft.Id, DecisionOutcome.Approve, "Order before the March price rise", submitted.Revision, None);
        Assert.Equal(1, decision.VersionNumber);
        Assert.Equal(submitted.Latest.AssumptionsHash, decision.AssumptionsHash);
        Assert.Equal(cycle.MarrPolicyVersionId, decision.MarrPolicyVersionId);
        Assert.Equal(ProposalStatus.Approved, (await db.Proposals.GetAsync(Lead, draft.Id, None)).Status);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Decisions.DecideAsync(Lead, draft.Id, DecisionOutcome.Reject, "", 0, None));
    }

    [Fact]
    public async Task The_cycle_is_decided_when_the_required_board_members_have_signed_off()
    {
        var cycle = await db.OpenCycleAsync("Sign-off 2027");
        var one = await db.Proposals.CreateDraftAsync(Lead, Draft(title: "Compressor"), None);
        var two = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Forklifts"), None);
        var s1 = await db.Proposals.SubmitAsync(Lead, one.Id, cycle.Id, one.Revision, None);
        var s2 = await db.Proposals.SubmitAsync(OtherLead, two.Id, cycle.Id, two.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, one.Id, DecisionOutcome.Approve, "", s1.Revision, None);

        var early = await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.SignOffAsync(Reviewer, cycle.Id, None));
        Assert.Contains(two.Reference, early.Message);

        await db.Decisions.DecideAsync(SecondReviewer, two.Id, DecisionOutcome.Reject, "Hire instead", s2.Revision, None);
        var first = await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        Assert.Contains(one.Reference, first.DecisionsSigned);
        Assert.Contains("\"Outcome\":\"Reject\"", first.DecisionsSigned);
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.SignOffAsync(Reviewer, cycle.Id, None));
        Assert.Equal(CycleStatus.Open, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);

        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        Assert.Equal(CycleStatus.Decided, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);
        var signOffs = await db.Decisions.SignOffsAsync(Reviewer, cycle.Id, None);
        Assert.Equal([Reviewer.UserId, SecondReviewer.UserId], signOffs.Current.Select(s => s.UserId));
        Assert.Empty(signOffs.Superseded);
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.DecideAsync(Reviewer, one.Id, DecisionOutcome.Reject, "", 0, None));
    }

    [Fact]
    public async Task A_sign_off_counts_only_for_the_decisions_it_signed_and_a_later_decision_supersedes_it()
    {
        var cycle = await db.OpenCycleAsync("Superseded 2027");
        var one = await db.Proposals.CreateDraftAsync(Lead, Draft(title: "Boiler feed pump"), None);
        var s1 = await db.Proposals.SubmitAsync(Lead, one.Id, cycle.Id, one.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, one.Id, DecisionOutcome.Approve, "", s1.Revision, None);
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);

        // A submission after the first sign-off, then its decision: the first sign-off never saw it.
        var two = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Dock levellers"), None);
        var s2 = await db.Proposals.SubmitAsync(OtherLead, two.Id, cycle.Id, two.Revision, None);
        await db.Decisions.DecideAsync(SecondReviewer, two.Id, DecisionOutcome.Reject, "Not this year", s2.Revision, None);
        await db.Decisions.SignOffAsync(SecondReviewer, cycle.Id, None);
        Assert.Equal(CycleStatus.Open, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);

        var between = await db.Decisions.SignOffsAsync(Finance, cycle.Id, None);
        Assert.Equal([SecondReviewer.UserId], between.Current.Select(s => s.UserId));
        Assert.Equal([Reviewer.UserId], between.Superseded.Select(s => s.UserId));
        Assert.Equal([one.Reference, two.Reference], between.Decisions.Select(d => d.Proposal).Order(StringComparer.Ordinal));

        // The first member signs again, the set as it now stands: that decides the cycle.
        await db.Decisions.SignOffAsync(Reviewer, cycle.Id, None);
        Assert.Equal(CycleStatus.Decided, (await db.Cycles.ListAsync(None)).Single(c => c.Id == cycle.Id).Status);
        var record = await db.Records.ForCycleAsync(cycle.Id, None);
        Assert.Equal([SecondReviewer.UserId, Reviewer.UserId], record.SignOffs.Select(s => s.UserId));
        Assert.All(record.SignOffs, s => Assert.Contains(two.Reference, s.DecisionsSigned, StringComparison.Ordinal));
    }

    [Fact]
    public async Task A_frozen_version_changed_in_the_database_is_flagged_on_every_read_and_cannot_be_decided()
    {
        var cycle = await db.OpenCycleAsync("Tampered 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(title: "Press brake"), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        Assert.True(submitted.Latest.Intact);
        await using (var context = db.NewContext())
        {
            // As someone who owns the database would: the write-once trigger lifted, the saving doubled, the hash left as it was.
            await TriggerBypass.LiftAsync(context, "proposal_version");
            await context.Database.ExecuteSqlRawAsync("UPDATE proposal_version SET \"AssumptionsJson\" = replace(\"AssumptionsJson\", '24000', '48000') WHERE \"ProposalId\" = {0}", draft.Id);
        }
        var read = await db.Proposals.GetAsync(Reviewer, draft.Id, None);
        Assert.False(read.Latest.Intact);
        Assert.Equal(submitted.Latest.AssumptionsHash, read.Latest.AssumptionsHash);
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => db.Decisions.DecideAsync(Reviewer, draft.Id, DecisionOutcome.Approve, "", read.Revision, None));
        Assert.Contains("no longer match their SHA-256", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Text_with_a_nul_character_is_refused_by_its_field_and_nothing_is_stored()
    {
        // PostgreSQL refuses U+0000 in text (common practice, no source; found by the draft fuzzer on PostgreSQL).
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, Draft(title: "Kiln\0burner"), None));
        Assert.Equal("title", refused.Field);
        Assert.StartsWith("Title: ", refused.Message, StringComparison.Ordinal);
        await using var context = db.NewContext();
        Assert.False(await context.Proposals.AnyAsync(p => p.Title.StartsWith("Kiln")));
    }

    [Fact]
    public async Task Decisions_and_sign_offs_cannot_be_edited()
    {
        var cycle = await db.OpenCycleAsync("Written once 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        await db.Decisions.DecideAsync(Reviewer, draft.Id, DecisionOutcome.Approve, "", submitted.Revision, None);
        await using var context = db.NewContext();
        var decision = await context.Decisions.SingleAsync(d => d.ProposalId == draft.Id);
        context.Entry(decision).Property(d => d.Outcome).CurrentValue = DecisionOutcome.Reject;
        Assert.Throws<RuleViolationException>(() => context.SaveChanges());
    }
}
