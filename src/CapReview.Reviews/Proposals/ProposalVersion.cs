namespace CapReview.Reviews.Proposals;

/// <summary>
/// A snapshot of a proposal's assumptions. A draft version may be edited in place; submitting freezes it, and once
/// frozen nothing may change or delete it (the context refuses such a save). A later change starts a new version.
/// </summary>
public sealed class ProposalVersion
{
    public int Id { get; set; }

    public int ProposalId { get; set; }

    /// <summary>1, 2, … within the proposal.</summary>
    public int Number { get; set; }

    public required string AuthorId { get; set; }

    public DateTimeOffset CreatedAt { get; set; }

    /// <summary>Why this version was made.</summary>
    public required string Reason { get; set; }

    public bool IsFrozen { get; set; }

    public DateTimeOffset? FrozenAt { get; set; }

    /// <summary>The assumptions as canonical JSON (see <see cref="AssumptionsDocument"/>).</summary>
    public required string AssumptionsJson { get; set; }

    /// <summary>SHA-256 of <see cref="AssumptionsJson"/>, hex: what packets and decisions cite.</summary>
    public required string AssumptionsHash { get; set; }

    /// <summary>Optimistic concurrency for edits of a draft.</summary>
    public int Revision { get; set; }
}
