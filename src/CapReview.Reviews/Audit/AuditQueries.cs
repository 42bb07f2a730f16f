using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Audit;

/// <summary>The administrator's view of the audit trail: recent events, the chain's head and its verification.</summary>
public sealed class AuditQueries(ReviewWork work, AuditTrail trail, AuditHeadLog headLog)
{
    public Task<List<AuditEvent>> RecentAsync(Actor actor, int count, CancellationToken cancellationToken)
    {
        RequireAdministrator(actor);
        return work.ReadAsync(db => AuditTrail.RecentAsync(db, count, cancellationToken), cancellationToken);
    }

    /// <summary>Where the chain stands now, to keep outside the database (the <c>audit-head</c> command).</summary>
    public Task<AuditHead> HeadAsync(CancellationToken cancellationToken) =>
        work.ReadAsync(db => AuditTrail.HeadAsync(db, cancellationToken), cancellationToken);

    /// <summary>Every link with its key, then every head the signed packets and the head log recorded.</summary>
    public Task<AuditVerification> VerifyAsync(Actor actor, CancellationToken cancellationToken)
    {
        RequireAdministrator(actor);
        return work.ReadAsync(async db =>
        {
            var anchors = new List<(AuditHead, string)>();
            var packets = await db.ApprovalPackets.AsNoTracking().Where(p => p.AuditHeadHash != null)
                .Select(p => new { p.FileName, p.AuditEventCount, p.AuditHeadHash }).ToListAsync(cancellationToken).ConfigureAwait(false);
            anchors.AddRange(packets.Select(p => (new AuditHead(p.AuditEventCount!.Value, p.AuditHeadHash!), $"The signed packet {p.FileName}")));
            anchors.AddRange(headLog.Read().Select(h => (h, $"The head log ({headLog.Path})")));
            return await trail.VerifyAsync(db, anchors, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    private static void RequireAdministrator(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can read the audit trail.");
        }
    }
}
