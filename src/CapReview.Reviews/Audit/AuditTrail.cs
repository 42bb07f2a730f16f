using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Audit;

/// <summary>Appends audit events to the keyed chain and verifies it.</summary>
public sealed class AuditTrail(TimeProvider clock, AuditKeyRing keys)
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
            previous, keys.Current);
        db.AuditEvents.Add(e);
        await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>
    /// Keys a chain whose newest event has no key (one written before the chain was keyed): a keyed event after it
    /// links, through its predecessor's hash, every older event, so none of them can change unnoticed any more. Call
    /// inside a <see cref="Common.ReviewWork"/> operation.
    /// </summary>
    public async Task SealAsync(CapReviewDbContext db, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        var newest = await db.AuditEvents.OrderByDescending(e => e.Id).Select(e => new { e.Id, e.KeyId }).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
        if (newest is { KeyId: null })
        {
            long older = await db.AuditEvents.LongCountAsync(cancellationToken).ConfigureAwait(false);
            await AppendAsync(db, Actor.Of("capreview", "CapReview"), "audit.keyed", "audit_event", newest.Id.ToString(System.Globalization.CultureInfo.InvariantCulture),
                null, new { Key = keys.Current.Id, EarlierEvents = older }, cancellationToken).ConfigureAwait(false);
        }
    }

    /// <summary>The newest events, newest first, for the administrator's audit page.</summary>
    public static Task<List<AuditEvent>> RecentAsync(CapReviewDbContext db, int count, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        return db.AuditEvents.AsNoTracking().OrderByDescending(e => e.Id).Take(count).ToListAsync(cancellationToken);
    }

    /// <summary>How many events the chain holds and the last one's hash.</summary>
    public static async Task<AuditHead> HeadAsync(CapReviewDbContext db, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        long count = await db.AuditEvents.LongCountAsync(cancellationToken).ConfigureAwait(false);
        string? hash = await db.AuditEvents.OrderByDescending(e => e.Id).Select(e => e.Hash).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
        return hash is null ? AuditHead.Empty : new AuditHead(count, hash);
    }

    /// <summary>
    /// Recomputes every link in order with the key each event names, then checks that every head recorded outside the
    /// database (<paramref name="anchors"/>: signed packets, the head log) is still in the chain at its place: an event
    /// cut from the end, or a chain rewritten after an anchor, shows there even though each remaining link holds.
    /// </summary>
    public async Task<AuditVerification> VerifyAsync(CapReviewDbContext db, IReadOnlyCollection<(AuditHead Head, string Source)> anchors, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(db);
        ArgumentNullException.ThrowIfNull(anchors);
        var wanted = anchors.Where(a => a.Head.Count > 0).GroupBy(a => a.Head.Count).ToDictionary(g => g.Key, g => g.ToList());
        string previous = AuditChain.Genesis;
        int checkedCount = 0, unkeyed = 0, anchorsChecked = 0;
        bool keyedSeen = false;
        long lastId = 0;
        await foreach (AuditEvent e in db.AuditEvents.AsNoTracking().OrderBy(e => e.Id).AsAsyncEnumerable().WithCancellation(cancellationToken))
        {
            if (e.PreviousHash != previous)
            {
                return new(false, checkedCount, e.Id, $"Event {e.Id} does not follow the event before it: an event was removed or inserted.", unkeyed);
            }
            string expected;
            if (e.KeyId is null)
            {
                if (keyedSeen)
                {
                    return new(false, checkedCount, e.Id, $"Event {e.Id} carries no key after keyed events: it was not written by the app.", unkeyed);
                }
                expected = AuditChain.HashOf(e, previous);
                unkeyed++;
            }
            else
            {
                keyedSeen = true;
                AuditKey? key = keys.Find(e.KeyId);
                if (key is null)
                {
                    return new(false, checkedCount, e.Id, $"Event {e.Id} names the key '{e.KeyId}', which this installation does not hold: configure it under Audit:Keys to verify.", unkeyed);
                }
                expected = AuditChain.HashOf(e, previous, key);
            }
            if (expected != e.Hash)
            {
                return new(false, checkedCount, e.Id, $"Event {e.Id} was changed after it was written.", unkeyed);
            }
            previous = e.Hash;
            lastId = e.Id;
            checkedCount++;
            if (wanted.Remove(checkedCount, out var here))
            {
                foreach (var (head, source) in here)
                {
                    if (head.Hash != e.Hash)
                    {
                        return new(false, checkedCount, e.Id, $"Event {e.Id} is not the one {source} recorded as the chain's head: the chain was rewritten from there or before.", unkeyed);
                    }
                    anchorsChecked++;
                }
            }
        }
        if (wanted.Count > 0)
        {
            var (head, source) = wanted.OrderBy(w => w.Key).First().Value[0];
            return new(false, checkedCount, null,
                $"{source} recorded {head.Count} events, but the chain holds {checkedCount}: events were cut from its end.", unkeyed, anchorsChecked);
        }
        if (checkedCount > 0 && !keyedSeen)
        {
            // The app keys every event it writes and keys an older chain on start: a chain without a key was rewritten.
            return new(false, checkedCount, lastId, "No event of the chain carries a key: it was rewritten without the installation's key.", unkeyed, anchorsChecked);
        }
        var final = new AuditHead(checkedCount, previous);
        string older = unkeyed == 0 ? "" : $" {unkeyed} of them were written before the chain was keyed and prove less.";
        return new(true, checkedCount, null, $"All {checkedCount} events are intact, and {anchorsChecked} recorded heads are in the chain.{older}", unkeyed, anchorsChecked, final);
    }
}
