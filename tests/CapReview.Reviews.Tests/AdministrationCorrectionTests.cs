using System.Text.Json;
using CapReview.Engine.Rates;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>An administrator's corrections: a MARR version retired as a mistake, an open cycle's dates and limit put right, and the audit trail searched.</summary>
public sealed class AdministrationCorrectionTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private Task<MarrPolicyVersion> AddAsync(double rate, string reason) =>
        db.Marr.AddVersionAsync(Admin, new NewMarrPolicy(rate, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), reason, 0.01, 0.02, 0.04), None);

    [Fact]
    public async Task A_retired_version_is_kept_but_no_new_cycle_pins_it_and_it_is_never_the_current_one()
    {
        var good = await AddAsync(0.09, "Board rate");
        var pinned = await db.Cycles.CreateAsync(Admin, new NewBudgetCycle("Retire pinned", 100_000m, good.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)), None);
        var mistake = await AddAsync(0.9, "Typed 90 instead of 9");
        Assert.Equal(mistake.Id, (await db.Marr.CurrentAsync(None))!.Id);

        await db.Marr.RetireAsync(Admin, mistake.Id, "90 % was a typing mistake", None);

        Assert.Contains(await db.Marr.ListAsync(None), v => v.Id == mistake.Id && v.Rate == 0.9);
        Assert.Equal("90 % was a typing mistake", (await db.Marr.RetirementsAsync(None))[mistake.Id].Reason);
        Assert.Equal(good.Id, (await db.Marr.CurrentAsync(None))!.Id);
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CreateAsync(Admin, new NewBudgetCycle("Retire refused", 100_000m, mistake.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)), None));
        Assert.Contains("retired", refused.Message);
        Assert.DoesNotContain(await db.Cycles.ListAsync(None), c => c.Name == "Retire refused");
        Assert.Equal(good.Id, (await db.Cycles.GetAsync(pinned.Id, None)).Cycle.MarrPolicyVersionId);

        await using var context = db.NewContext();
        var e = await context.AuditEvents.Where(a => a.Action == "marr.version-retired").OrderBy(a => a.Id).LastAsync();
        Assert.Equal(mistake.Number.ToString(System.Globalization.CultureInfo.InvariantCulture), e.EntityId);
        Assert.Contains("90 % was a typing mistake", e.After);
    }

    [Fact]
    public async Task A_retirement_is_written_once_and_only_once_per_version()
    {
        var mistake = await AddAsync(0.5, "Wrong rate");
        await db.Marr.RetireAsync(Admin, mistake.Id, "Wrong rate", None);
        var again = await Assert.ThrowsAsync<RuleViolationException>(() => db.Marr.RetireAsync(Admin, mistake.Id, "Again", None));
        Assert.Contains("already retired", again.Message);
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Marr.RetireAsync(Lead, mistake.Id, "Not mine to retire", None));
        await Assert.ThrowsAsync<RuleViolationException>(() => db.Marr.RetireAsync(Admin, mistake.Id, "  ", None));

        await using var context = db.NewContext();
        var stored = await context.MarrVersionRetirements.SingleAsync(r => r.MarrPolicyVersionId == mistake.Id);
        context.MarrVersionRetirements.Remove(stored);
        Assert.Throws<RuleViolationException>(() => context.SaveChanges());
        await using var bulk = db.NewContext();
        await Assert.ThrowsAnyAsync<Exception>(() => bulk.MarrVersionRetirements.Where(r => r.MarrPolicyVersionId == mistake.Id).ExecuteDeleteAsync());
        Assert.True(await bulk.MarrVersionRetirements.AnyAsync(r => r.MarrPolicyVersionId == mistake.Id));
    }

    [Fact]
    public async Task An_open_cycle_s_dates_and_limit_are_corrected_and_audited_with_before_and_after()
    {
        var cycle = await db.OpenCycleAsync("Correct me", 1_000_000m);
        var corrected = await db.Cycles.CorrectAsync(Admin, cycle.Id, new CycleCorrection(1_250_000m, new DateOnly(2027, 1, 15), new DateOnly(2027, 4, 30)), cycle.Revision, None);

        var stored = (await db.Cycles.GetAsync(cycle.Id, None)).Cycle;
        Assert.Equal(1_250_000m, stored.CapitalLimit);
        Assert.Equal(new DateOnly(2027, 1, 15), stored.OpensOn);
        Assert.Equal(new DateOnly(2027, 4, 30), stored.ClosesOn);
        Assert.Equal(cycle.Revision + 1, corrected.Revision);

        await using var context = db.NewContext();
        var e = await context.AuditEvents.Where(a => a.Action == "cycle.corrected").OrderBy(a => a.Id).LastAsync();
        using var before = JsonDocument.Parse(e.Before!);
        using var after = JsonDocument.Parse(e.After!);
        Assert.Equal(1_000_000m, before.RootElement.GetProperty("capitalLimit").GetDecimal());
        Assert.Equal("2027-03-31", before.RootElement.GetProperty("closesOn").GetString());
        Assert.Equal(1_250_000m, after.RootElement.GetProperty("capitalLimit").GetDecimal());
        Assert.Equal("2027-04-30", after.RootElement.GetProperty("closesOn").GetString());
    }

    [Fact]
    public async Task A_cycle_is_corrected_only_while_open_and_only_with_terms_a_new_cycle_could_have()
    {
        var cycle = await db.OpenCycleAsync("Correct refused", 500_000m);
        var zero = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CorrectAsync(Admin, cycle.Id, new CycleCorrection(0m, cycle.OpensOn, cycle.ClosesOn), cycle.Revision, None));
        Assert.Contains("capital limit", zero.Message);
        var huge = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CorrectAsync(Admin, cycle.Id, new CycleCorrection(10_000_000_000_000_000m, cycle.OpensOn, cycle.ClosesOn), cycle.Revision, None));
        Assert.StartsWith("Capital limit: the capital limit must be less than", huge.Message, StringComparison.Ordinal);
        await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CorrectAsync(Admin, cycle.Id, new CycleCorrection(500_000m, new DateOnly(2027, 5, 1), new DateOnly(2027, 4, 1)), cycle.Revision, None));
        await Assert.ThrowsAsync<AccessDeniedException>(() =>
            db.Cycles.CorrectAsync(Reviewer, cycle.Id, new CycleCorrection(600_000m, cycle.OpensOn, cycle.ClosesOn), cycle.Revision, None));

        var inReview = await db.Cycles.MoveAsync(Admin, cycle.Id, CycleStatus.InReview, cycle.Revision, None);
        var closed = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Cycles.CorrectAsync(Admin, cycle.Id, new CycleCorrection(600_000m, cycle.OpensOn, cycle.ClosesOn), inReview.Revision, None));
        Assert.Contains("no longer open", closed.Message);
        Assert.Equal(500_000m, (await db.Cycles.GetAsync(cycle.Id, None)).Cycle.CapitalLimit);
    }

    [Fact]
    public void The_entity_refuses_a_correction_once_its_review_has_started()
    {
        var cycle = BudgetCycle.Open(new NewBudgetCycle("Entity", 10m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)));
        cycle.Correct(Admin, new CycleCorrection(20m, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)));
        Assert.Equal(20m, cycle.CapitalLimit);
        Assert.Throws<RuleViolationException>(() => cycle.Correct(Admin, new CycleCorrection(20m, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1))));
        cycle.StartReview(Admin);
        Assert.Throws<RuleViolationException>(() => cycle.Correct(Admin, new CycleCorrection(30m, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1))));
        Assert.Equal(20m, cycle.CapitalLimit);
    }

    [Fact]
    public async Task The_trail_is_filtered_by_proposal_person_and_days_and_names_people_and_proposals()
    {
        var cycle = await db.OpenCycleAsync("Audit search");
        var mine = await db.Proposals.CreateDraftAsync(Lead, Draft("Paint line chiller"), None);
        await db.Proposals.SubmitAsync(Lead, mine.Id, cycle.Id, mine.Revision, None);
        var theirs = await db.Proposals.CreateDraftAsync(OtherLead, Draft("Compressor heat recovery"), None);
        var search = db.Get<AuditSearch>();

        var onMine = await search.SearchAsync(Admin, new AuditFilter(ProposalReference: mine.Reference), 100, None);
        Assert.Equal(["proposal.submitted", "proposal.created"], onMine.Rows.Select(r => r.Action));
        Assert.All(onMine.Rows, r => Assert.Equal($"{mine.Reference} Paint line chiller", r.Item));
        Assert.All(onMine.Rows, r => Assert.Equal("Oskar Lead", r.Person));

        var byOther = await search.SearchAsync(Admin, new AuditFilter(UserId: OtherLead.UserId), 100, None);
        var created = Assert.Single(byOther.Rows);
        Assert.Equal("Maren Lead", created.Person);
        Assert.Equal($"{theirs.Reference} Compressor heat recovery", created.Item);

        var cycleRow = (await search.SearchAsync(Admin, new AuditFilter(UserId: Admin.UserId), 1, None)).Rows.Single();
        Assert.Equal("Cycle Audit search", cycleRow.Item);
        Assert.Equal("Ines Admin", cycleRow.Person);

        var today = DateOnly.FromDateTime(DateTime.UtcNow);
        Assert.Empty((await search.SearchAsync(Admin, new AuditFilter(From: today.AddDays(1)), 100, None)).Rows);
        Assert.Empty((await search.SearchAsync(Admin, new AuditFilter(To: today.AddDays(-1)), 100, None)).Rows);
        Assert.Equal(2, (await search.SearchAsync(Admin, new AuditFilter(mine.Reference, null, today, today), 100, None)).Rows.Count);

        var limited = await search.SearchAsync(Admin, new AuditFilter(ProposalReference: mine.Reference), 1, None);
        Assert.True(limited.More);
        Assert.Single(limited.Rows);
    }

    [Fact]
    public async Task A_search_with_days_in_the_wrong_order_or_an_unknown_proposal_is_refused_and_only_administrators_search()
    {
        var search = db.Get<AuditSearch>();
        var order = await Assert.ThrowsAsync<RuleViolationException>(() => search.SearchAsync(Admin, new AuditFilter(From: new DateOnly(2027, 2, 1), To: new DateOnly(2027, 1, 1)), 10, None));
        Assert.Equal("to", order.Field);
        Assert.StartsWith("To: ", order.Message, StringComparison.Ordinal);
        var unknown = await Assert.ThrowsAsync<RuleViolationException>(() => search.SearchAsync(Admin, new AuditFilter(ProposalReference: "P-1999-999"), 10, None));
        Assert.Contains("P-1999-999", unknown.Message);
        await Assert.ThrowsAsync<AccessDeniedException>(() => search.SearchAsync(Reviewer, new AuditFilter(), 10, None));
    }
}
