using CapReview.Reviews.Audit;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>Each test has a database of its own so that it sees the whole chain.</summary>
public sealed class AuditTrailTests : IAsyncLifetime
{
    private readonly ReviewsDatabase _db = new();

    public Task InitializeAsync() => _db.InitializeAsync();

    public Task DisposeAsync() => _db.DisposeAsync();

    private async Task<AuditVerification> VerifyAsync()
    {
        await using var context = _db.NewContext();
        return await AuditTrail.VerifyAsync(context, CancellationToken.None);
    }

    /// <summary>Tampering as someone who owns the database would: the write-once trigger lifted first, then the SQL.</summary>
    private async Task TamperAsync(string sql)
    {
        await using var context = _db.NewContext();
        await TriggerBypass.LiftAsync(context, "audit_event");
        await context.Database.ExecuteSqlRawAsync(sql);
    }

    private async Task MakeHistoryAsync()
    {
        var cycle = await _db.OpenCycleAsync("Audit 2027");
        var draft = await _db.Proposals.CreateDraftAsync(Lead, Draft(), CancellationToken.None);
        await _db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);
    }

    [Fact]
    public async Task Every_change_is_recorded_in_an_intact_chain()
    {
        await MakeHistoryAsync();
        await using var context = _db.NewContext();
        var actions = await context.AuditEvents.OrderBy(e => e.Id).Select(e => e.Action).ToListAsync();
        Assert.Equal(["marr.version-added", "cycle.created", "proposal.created", "proposal.submitted"], actions);
        var submitted = await context.AuditEvents.OrderBy(e => e.Id).LastAsync();
        Assert.Equal(Lead.UserId, submitted.UserId);
        Assert.Contains("\"status\":\"Draft\"", submitted.Before);
        Assert.Contains("\"status\":\"Submitted\"", submitted.After);
        var verification = await VerifyAsync();
        Assert.True(verification.Intact, verification.Message);
        Assert.Equal(4, verification.EventsChecked);
    }

    [Fact]
    public async Task An_edited_row_is_detected()
    {
        await MakeHistoryAsync();
        await TamperAsync("UPDATE audit_event SET \"After\" = replace(\"After\", 'Submitted', 'Approved') WHERE \"Id\" = 4");
        var verification = await VerifyAsync();
        Assert.False(verification.Intact);
        Assert.Equal(4, verification.FirstBrokenEventId);
        Assert.Contains("changed after it was written", verification.Message);
    }

    [Fact]
    public async Task A_removed_row_is_detected()
    {
        await MakeHistoryAsync();
        await TamperAsync("DELETE FROM audit_event WHERE \"Id\" = 2");
        var verification = await VerifyAsync();
        Assert.False(verification.Intact);
        Assert.Equal(3, verification.FirstBrokenEventId);
    }

    [Fact]
    public async Task The_context_refuses_to_change_or_delete_an_event()
    {
        await MakeHistoryAsync();
        await using var context = _db.NewContext();
        var first = await context.AuditEvents.OrderBy(e => e.Id).FirstAsync();
        context.Entry(first).Property(e => e.UserId).CurrentValue = "someone-else";
        Assert.Throws<Common.RuleViolationException>(() => context.SaveChanges());
    }
}
