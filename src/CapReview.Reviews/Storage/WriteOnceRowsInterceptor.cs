using CapReview.Reviews.Audit;
using CapReview.Reviews.Comments;
using CapReview.Reviews.Common;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.ChangeTracking;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace CapReview.Reviews.Storage;

/// <summary>
/// Refuses a save that would change or delete a row written once: a frozen proposal version, a decision, a sign-off, a
/// comment, a MARR policy version, an approval packet, an audit event. The entities offer no way to do so; this catches
/// what reaches them through EF's own API (<c>Entry(…).Property(…).CurrentValue</c>, <c>Remove</c>). Bulk updates and
/// raw SQL bypass EF's change tracker, so the database's triggers (migration WriteOnceTriggers) guard those.
/// </summary>
public sealed class WriteOnceRowsInterceptor : SaveChangesInterceptor
{
    /// <summary>Stateless, so one instance serves every context.</summary>
    public static WriteOnceRowsInterceptor Instance { get; } = new();

    private WriteOnceRowsInterceptor()
    {
    }

    public override InterceptionResult<int> SavingChanges(DbContextEventData eventData, InterceptionResult<int> result)
    {
        ArgumentNullException.ThrowIfNull(eventData);
        Refuse(eventData.Context);
        return result;
    }

    public override ValueTask<InterceptionResult<int>> SavingChangesAsync(DbContextEventData eventData, InterceptionResult<int> result,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(eventData);
        Refuse(eventData.Context);
        return ValueTask.FromResult(result);
    }

    private static void Refuse(DbContext? context)
    {
        if (context is null)
        {
            return;
        }
        // Entries() detects changes first: EF calls interceptors before its own detection.
        foreach (EntityEntry entry in context.ChangeTracker.Entries())
        {
            if (entry.State is not (EntityState.Modified or EntityState.Deleted))
            {
                continue;
            }
            switch (entry.Entity)
            {
                // The original value, not the current one: thawing a frozen version is a change to a frozen version.
                case ProposalVersion when entry.OriginalValues.GetValue<bool>(nameof(ProposalVersion.IsFrozen)):
                    throw new RuleViolationException(ProposalVersion.FrozenMessage);
                case AuditEvent:
                    throw new RuleViolationException("The audit trail is append-only.");
                case MarrPolicyVersion:
                    throw new RuleViolationException("A MARR policy version cannot be changed or deleted; add a new version.");
                case MarrVersionRetirement:
                    throw new RuleViolationException("A MARR version's retirement is written once and cannot be undone.");
                case Decision or SignOff or ProposalComment:
                    throw new RuleViolationException("Decisions and sign-offs are written once: record a new decision instead.");
                case ApprovalPacket:
                    throw new RuleViolationException("An approval packet is stored once and never changed.");
                case Interchange.CycleImport:
                    throw new RuleViolationException("The record of an import is written once.");
            }
        }
    }
}
