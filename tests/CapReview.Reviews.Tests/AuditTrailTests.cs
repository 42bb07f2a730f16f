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
        return await _db.Audit.VerifyAsync(context, [], CancellationToken.None);
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

    /// <summary>Rewrites the chain from the start as someone without the key would: every hash a plain SHA-256, recomputed in order.</summary>
    private async Task RewriteWithoutKeyAsync(Func<AuditEvent, string?> after, bool dropKeys)
    {
        await using var context = _db.NewContext();
        await TriggerBypass.LiftAsync(context, "audit_event");
        var events = await context.AuditEvents.AsNoTracking().OrderBy(e => e.Id).ToListAsync();
        string previous = AuditChain.Genesis;
        foreach (AuditEvent e in events)
        {
            string? newAfter = after(e);
            await context.Database.ExecuteSqlRawAsync("UPDATE audit_event SET \"After\" = {0} WHERE \"Id\" = {1}", newAfter!, e.Id);
            var changed = await context.AuditEvents.AsNoTracking().SingleAsync(x => x.Id == e.Id);
            string hash = AuditChain.HashOf(changed, previous);
            await context.Database.ExecuteSqlRawAsync(
                dropKeys ? "UPDATE audit_event SET \"PreviousHash\" = {0}, \"Hash\" = {1}, \"KeyId\" = NULL WHERE \"Id\" = {2}"
                         : "UPDATE audit_event SET \"PreviousHash\" = {0}, \"Hash\" = {1} WHERE \"Id\" = {2}",
                previous, hash, e.Id);
            previous = hash;
        }
    }

    [Fact]
    public async Task A_chain_rewritten_and_rehashed_without_the_key_is_detected()
    {
        await MakeHistoryAsync();
        await RewriteWithoutKeyAsync(e => e.Id == 4 ? e.After!.Replace("Submitted", "Approved", StringComparison.Ordinal) : e.After, dropKeys: false);
        var kept = await VerifyAsync();
        Assert.False(kept.Intact);
        Assert.Equal(1, kept.FirstBrokenEventId);
        Assert.Contains("changed after it was written", kept.Message, StringComparison.Ordinal);

        // Passing every event off as one written before the chain was keyed does not help either.
        await RewriteWithoutKeyAsync(e => e.After, dropKeys: true);
        var unkeyed = await VerifyAsync();
        Assert.False(unkeyed.Intact);
        Assert.Contains("No event of the chain carries a key", unkeyed.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Events_cut_from_the_end_are_detected_by_a_head_kept_outside_the_database()
    {
        await MakeHistoryAsync();
        AuditHead head;
        await using (var context = _db.NewContext())
        {
            head = await AuditTrail.HeadAsync(context, CancellationToken.None);
        }
        Assert.Equal(4, head.Count);
        await TamperAsync("DELETE FROM audit_event WHERE \"Id\" = 4");

        // Each remaining link holds; only the recorded head shows what is missing.
        Assert.True((await VerifyAsync()).Intact);
        await using var check = _db.NewContext();
        var anchored = await _db.Audit.VerifyAsync(check, [(head, "The head log")], CancellationToken.None);
        Assert.False(anchored.Intact);
        Assert.Equal("The head log recorded 4 events, but the chain holds 3: events were cut from its end.", anchored.Message);
    }

    [Fact]
    public async Task A_chain_written_before_it_was_keyed_is_sealed_by_a_keyed_event_and_then_cannot_change()
    {
        await MakeHistoryAsync();
        // The chain as an older version wrote it: plain SHA-256 hashes, no key.
        await RewriteWithoutKeyAsync(e => e.After, dropKeys: true);
        await _db.Get<Common.ReviewWork>().RunAsync(async db =>
        {
            await _db.Audit.SealAsync(db, CancellationToken.None);
            return true;
        }, CancellationToken.None);
        var sealedChain = await VerifyAsync();
        Assert.True(sealedChain.Intact, sealedChain.Message);
        Assert.Equal((5, 4), (sealedChain.EventsChecked, sealedChain.UnkeyedEvents));

        // An old event changed and every plain hash after it recomputed: the keyed seal no longer follows.
        await using (var context = _db.NewContext())
        {
            await TriggerBypass.LiftAsync(context, "audit_event");
            var events = await context.AuditEvents.AsNoTracking().OrderBy(e => e.Id).Take(4).ToListAsync();
            string previous = AuditChain.Genesis;
            foreach (AuditEvent e in events)
            {
                if (e.Id == 2)
                {
                    await context.Database.ExecuteSqlRawAsync("UPDATE audit_event SET \"UserId\" = 'someone-else' WHERE \"Id\" = 2");
                }
                var current = await context.AuditEvents.AsNoTracking().SingleAsync(x => x.Id == e.Id);
                string hash = AuditChain.HashOf(current, previous);
                await context.Database.ExecuteSqlRawAsync("UPDATE audit_event SET \"PreviousHash\" = {0}, \"Hash\" = {1} WHERE \"Id\" = {2}", previous, hash, e.Id);
                previous = hash;
            }
        }
        var broken = await VerifyAsync();
        Assert.False(broken.Intact);
        Assert.Equal(5, broken.FirstBrokenEventId);
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
