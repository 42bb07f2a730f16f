namespace CapReview.Reviews.Audit;

/// <summary>
/// One append-only record of a change: who, when, what, before and after, chained to the previous event by SHA-256 so
/// that an edited or removed row breaks the chain.
/// </summary>
public sealed class AuditEvent
{
    public long Id { get; set; }

    public DateTimeOffset At { get; set; }

    public required string UserId { get; set; }

    /// <summary>e.g. proposal.created, proposal.submitted.</summary>
    public required string Action { get; set; }

    public required string EntityType { get; set; }

    public required string EntityId { get; set; }

    public string? Before { get; set; }

    public string? After { get; set; }

    public required string PreviousHash { get; set; }

    public required string Hash { get; set; }
}
