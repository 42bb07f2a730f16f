using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Audit;

/// <summary>Appends audit events to the chain and verifies it.</summary>
public sealed class AuditTrail(TimeProvider clock)
{
    private static readonly JsonSerializerOptions Snapshot = new(JsonSerializerDefaults.Web);

    /// <summary>
    /// Adds and saves one event linked to the newest one. Call inside the operation's transaction (see
    /// <see cref="Common.ReviewWork"/>), which keeps the chain's writes one at a time.
    /// </summary>
    public async Task AppendAsync(CapReviewDbContext db, Actor actor, string action, string entityType, string entityId,
        object? before, object? after, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        ArgumentNullException.ThrowIfNull(actor);
        string previous = await db.AuditEvents.OrderByDescending(e => e.Id).Select(e => e.Hash)
            .FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false) ?? AuditChain.Genesis;
        var e = AuditEvent.Chained(clock.GetUtcNow(), actor.UserId, action, entityType, entityId,
            before is null ? null : JsonSerializer.Serialize(before, Snapshot),
            after is null ? null : JsonSerializer.Serialize(after, Snapshot),
            previous);
        db.AuditEvents.Add(e);
        await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The newest events, newest first, for the administrator's audit page.</summary>
    public static Task<List<AuditEvent>> RecentAsync(CapReviewDbContext db, int count, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        return db.AuditEvents.AsNoTracking().OrderByDescending(e => e.Id).Take(count).ToListAsync(cancellationToken);
    }

    /// <summary>Recomputes every hash in order; the first event that does not match its stored hash or link is reported.</summary>
    public static async Task<AuditVerification> VerifyAsync(CapReviewDbContext db, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        string previous = AuditChain.Genesis;
        int checkedCount = 0;
        await foreach (AuditEvent e in db.AuditEvents.AsNoTracking().OrderBy(e => e.Id).AsAsyncEnumerable().WithCancellation(cancellationToken))
        {
            if (e.PreviousHash != previous)
            {
                return new(false, checkedCount, e.Id, $"Event {e.Id} does not follow the event before it: an event was removed or inserted.");
            }
            if (AuditChain.HashOf(e, previous) != e.Hash)
            {
                return new(false, checkedCount, e.Id, $"Event {e.Id} was changed after it was written.");
            }
            previous = e.Hash;
            checkedCount++;
        }
        return new(true, checkedCount, null, $"All {checkedCount} events are intact.");
    }
}
