using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class ProposalVersionTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_draft_is_edited_in_place_until_it_is_submitted()
    {
        var created = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        Assert.Matches(@"^P-\d{4}$", created.Reference);
        Assert.Equal(ProposalStatus.Draft, created.Status);
        var edited = await db.Proposals.UpdateDraftAsync(Lead, created.Id, created.Revision, Draft(firstCost: -125_000), None);
        Assert.Single(edited.Versions);
        Assert.False(edited.Latest.IsFrozen);
        Assert.NotEqual(created.Latest.AssumptionsHash, edited.Latest.AssumptionsHash);
        Assert.Equal(-125_000, edited.Latest.Assumptions.Model.Elements![0]!.Amount);
    }

    [Fact]
    public async Task Submitting_freezes_the_version_and_a_later_change_makes_a_new_one()
    {
        var cycle = await db.OpenCycleAsync("Versions 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);
        Assert.True(submitted.Latest.IsFrozen);
        Assert.Equal(cycle.Id, submitted.BudgetCycleId);

        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.UpdateDraftAsync(Lead, draft.Id, submitted.Revision, Draft(firstCost: -1), None));

        var returned = await db.Proposals.TransitionAsync(Reviewer, draft.Id, ProposalStatus.ReturnedForChanges, submitted.Revision, None);
        var noReason = Draft(firstCost: -130_000);
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.UpdateDraftAsync(Lead, draft.Id, returned.Revision, noReason, None));
        var revised = await db.Proposals.UpdateDraftAsync(Lead, draft.Id, returned.Revision, Draft(firstCost: -130_000, reason: "Supplier quote came in higher"), None);

        Assert.Equal([1, 2], revised.Versions.Select(v => v.Number));
        Assert.Equal(submitted.Latest.AssumptionsHash, revised.Versions[0].AssumptionsHash);
        Assert.True(revised.Versions[0].IsFrozen);
        Assert.False(revised.Versions[1].IsFrozen);
        Assert.Equal("Supplier quote came in higher", revised.Versions[1].Reason);
    }

    [Fact]
    public async Task No_code_path_changes_or_deletes_a_frozen_version()
    {
        var cycle = await db.OpenCycleAsync("Frozen 2027");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None);

        await using (var context = db.NewContext())
        {
            var frozen = await context.ProposalVersions.SingleAsync(v => v.ProposalId == draft.Id);
            context.Entry(frozen).Property(v => v.AssumptionsJson).CurrentValue = "{}";
            Assert.Throws<RuleViolationException>(() => context.SaveChanges());
        }
        await using (var context = db.NewContext())
        {
            var frozen = await context.ProposalVersions.SingleAsync(v => v.ProposalId == draft.Id);
            context.ProposalVersions.Remove(frozen);
            await Assert.ThrowsAsync<RuleViolationException>(() => context.SaveChangesAsync());
        }
        var stored = await db.Proposals.GetAsync(Lead, draft.Id, None);
        Assert.Equal(draft.Latest.AssumptionsHash, stored.Latest.AssumptionsHash);
    }

    [Fact]
    public async Task Submitting_needs_a_complete_model_and_an_open_cycle()
    {
        var cycle = await db.OpenCycleAsync("Complete 2027");
        var incomplete = Draft() with
        {
            Assumptions = new ProposalAssumptions { Model = Draft().Assumptions.Model with { Horizon = null } },
        };
        var draft = await db.Proposals.CreateDraftAsync(Lead, incomplete, None);
        var error = await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, None));
        Assert.Contains("horizon", error.Message);
        await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.SubmitAsync(Lead, draft.Id, 9999, draft.Revision, None));
    }

    [Fact]
    public async Task Two_people_saving_the_same_draft_get_a_conflict_and_nothing_is_lost()
    {
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        var first = await db.Proposals.UpdateDraftAsync(Lead, draft.Id, draft.Revision, Draft(title: "First tab's title"), None);
        var conflict = await Assert.ThrowsAsync<ConcurrencyConflictException>(() =>
            db.Proposals.UpdateDraftAsync(Lead, draft.Id, draft.Revision, Draft(title: "Second tab's title"), None));
        Assert.Contains("Someone else changed this", conflict.Message);
        var stored = await db.Proposals.GetAsync(Lead, draft.Id, None);
        Assert.Equal("First tab's title", stored.Title);
        Assert.Equal(first.Revision, stored.Revision);
    }

    [Fact]
    public async Task A_lead_cannot_read_or_change_another_leads_draft_by_id()
    {
        var theirs = await db.Proposals.CreateDraftAsync(OtherLead, Draft(title: "Their draft"), None);
        await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.GetAsync(Lead, theirs.Id, None));
        await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.UpdateDraftAsync(Lead, theirs.Id, theirs.Revision, Draft(), None));
        await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.GetAsync(Reviewer, theirs.Id, None));
        await Assert.ThrowsAsync<NotFoundException>(() => db.Proposals.GetAsync(Finance, theirs.Id, None));
        Assert.Equal("Their draft", (await db.Proposals.GetAsync(Admin, theirs.Id, None)).Title);
        Assert.DoesNotContain(await db.Proposals.ListOwnAsync(Lead, None), p => p.Id == theirs.Id);
    }

    [Fact]
    public async Task Only_project_leads_start_proposals_and_a_title_is_required()
    {
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Proposals.CreateDraftAsync(Reviewer, Draft(), None));
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, Draft(title: "  "), None));
    }

    [Fact]
    public async Task The_assumptions_hash_is_the_SHA256_of_the_canonical_json()
    {
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), None);
        // New versions are written with element identities (stamped e1, e2, … when the draft names none).
        string json = AssumptionsDocument.Serialize(ElementIdentities.Stamp(Draft().Assumptions));
        // Outside reference: System.Security.Cryptography.SHA256 over the UTF-8 bytes, computed here independently.
        string expected = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(json)));
        Assert.Equal(expected, draft.Latest.AssumptionsHash);
        Assert.StartsWith("{\"model\":{\"periodsPerYear\":1,\"horizon\":10,\"elements\":[{\"id\":\"e1\",\"type\":\"single\"", json);
    }

    [Fact]
    public async Task A_marr_of_its_own_needs_a_reason_and_a_valid_rate()
    {
        var withOverride = Draft() with
        {
            Assumptions = Draft().Assumptions with { MarrOverride = new MarrOverride(new Engine.Specifications.RateSpec { Value = 0.14 }, "") },
        };
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, withOverride, None));
        var badRate = withOverride with
        {
            Assumptions = withOverride.Assumptions with { MarrOverride = new MarrOverride(new Engine.Specifications.RateSpec { Value = -2 }, "Grant terms") },
        };
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Proposals.CreateDraftAsync(Lead, badRate, None));
        var good = withOverride with
        {
            Assumptions = withOverride.Assumptions with { MarrOverride = new MarrOverride(new Engine.Specifications.RateSpec { Value = 0.14 }, "Grant terms require 14%") },
        };
        var created = await db.Proposals.CreateDraftAsync(Lead, good, None);
        Assert.Equal("Grant terms require 14%", created.Latest.Assumptions.MarrOverride!.Reason);
        // Evaluated at its own MARR, not the policy's: PW = −120,000 + 24,000 (P/A, 14%, 10), by Microsoft.VisualBasic.Financial.PV.
        var evaluation = VersionComparison.Evaluate(created.Latest.Assumptions, Engine.Rates.AnnualRate.Effective(0.08))!;
        Assert.Equal(-120_000 - Microsoft.VisualBasic.Financial.PV(0.14, 10, 24_000), evaluation.PresentWorth, 6);
    }
}
