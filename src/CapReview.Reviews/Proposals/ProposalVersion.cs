using CapReview.Reviews.Common;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// A snapshot of a proposal's assumptions. A draft version may be edited in place; submitting freezes it, and once
/// frozen nothing may change or delete it (the version itself, the write-once interceptor and a database trigger
/// refuse). A later change starts a new version.
/// </summary>
public sealed class ProposalVersion
{
    internal const string FrozenMessage = "A submitted version is frozen: it cannot be changed or deleted. Make a new version instead.";

    private ProposalVersion()
    {
    }

    public int Id { get; private set; }

    public int ProposalId { get; private set; }

    /// <summary>1, 2, … within the proposal.</summary>
    public int Number { get; private set; }

    public string AuthorId { get; private set; } = "";

    public DateTimeOffset CreatedAt { get; private set; }

    /// <summary>Why this version was made.</summary>
    public string Reason { get; private set; } = "";

    public bool IsFrozen { get; private set; }

    public DateTimeOffset? FrozenAt { get; private set; }

    /// <summary>The assumptions as canonical JSON (see <see cref="AssumptionsDocument"/>).</summary>
    public string AssumptionsJson { get; private set; } = "";

    /// <summary>SHA-256 of <see cref="AssumptionsJson"/>, hex: what packets and decisions cite.</summary>
    public string AssumptionsHash { get; private set; } = "";

    /// <summary>
    /// Whether the stored assumptions still give their stored SHA-256: false only when the row was changed outside the
    /// app (the entities and the triggers refuse it), which every read of a version checks.
    /// </summary>
    public bool Intact => AssumptionsDocument.Hash(AssumptionsJson) == AssumptionsHash;

    /// <summary>Optimistic concurrency for edits of a draft.</summary>
    public int Revision { get; private set; }

    /// <summary>A new draft version with its assumptions as canonical JSON.</summary>
    internal static ProposalVersion Draft(int number, string authorId, DateTimeOffset createdAt, string reason, string assumptionsJson) => new()
    {
        Number = number,
        AuthorId = authorId,
        CreatedAt = createdAt,
        Reason = reason,
        AssumptionsJson = assumptionsJson,
        AssumptionsHash = AssumptionsDocument.Hash(assumptionsJson),
    };

    /// <summary>A version as another installation recorded it: frozen or not, as the cycle document says.</summary>
    internal static ProposalVersion Imported(int number, string authorId, DateTimeOffset createdAt, string reason, string assumptionsJson, bool frozen, DateTimeOffset? frozenAt)
    {
        ProposalVersion version = Draft(number, authorId, createdAt, reason, assumptionsJson);
        version.IsFrozen = frozen;
        version.FrozenAt = frozen ? frozenAt : null;
        return version;
    }

    /// <summary>Replaces the assumptions of a draft; a frozen version refuses.</summary>
    internal void EditAssumptions(string assumptionsJson)
    {
        if (IsFrozen)
        {
            throw new RuleViolationException(FrozenMessage);
        }
        AssumptionsJson = assumptionsJson;
        AssumptionsHash = AssumptionsDocument.Hash(assumptionsJson);
        Revision++;
    }

    /// <summary>Freezes the version at submission; it is never thawed.</summary>
    internal void Freeze(DateTimeOffset at)
    {
        if (IsFrozen)
        {
            throw new RuleViolationException(FrozenMessage);
        }
        IsFrozen = true;
        FrozenAt = at;
    }
}
