namespace CapReview.Reviews.Audit;

/// <summary>
/// One append-only record of a change: who, when, what, before and after, chained to the previous event by an
/// HMAC-SHA256 keyed outside the database (<see cref="AuditChain"/>), so that an edited or removed row breaks the chain
/// and cannot be mended without the key.
/// </summary>
public sealed class AuditEvent
{
    private AuditEvent()
    {
    }

    /// <summary>The event that follows <paramref name="previousHash"/>, its own hash keyed with <paramref name="key"/>.</summary>
    public static AuditEvent Chained(DateTimeOffset at, string userId, string action, string entityType, string entityId,
        string? before, string? after, string previousHash, AuditKey key)
    {
        ArgumentNullException.ThrowIfNull(key);
        var e = new AuditEvent
        {
            At = at,
            UserId = userId,
            Action = action,
            EntityType = entityType,
            EntityId = entityId,
            Before = before,
            After = after,
            PreviousHash = previousHash,
            KeyId = key.Id,
        };
        e.Hash = AuditChain.HashOf(e, previousHash, key);
        return e;
    }

    public long Id { get; private set; }

    public DateTimeOffset At { get; private set; }

    public string UserId { get; private set; } = "";

    /// <summary>e.g. proposal.created, proposal.submitted.</summary>
    public string Action { get; private set; } = "";

    public string EntityType { get; private set; } = "";

    public string EntityId { get; private set; } = "";

    public string? Before { get; private set; }

    public string? After { get; private set; }

    public string PreviousHash { get; private set; } = "";

    public string Hash { get; private set; } = "";

    /// <summary>The key that made <see cref="Hash"/>; null for an event written before the chain was keyed.</summary>
    public string? KeyId { get; private set; }
}
