using CapReview.Reviews.Access;
using CapReview.Reviews.Common;

namespace CapReview.Reviews.Audit;

/// <summary>The administrator's view of the audit trail: recent events and the chain's verification.</summary>
public sealed class AuditQueries(ReviewWork work)
{
    public Task<List<AuditEvent>> RecentAsync(Actor actor, int count, CancellationToken cancellationToken)
    {
        RequireAdministrator(actor);
        return work.ReadAsync(db => AuditTrail.RecentAsync(db, count, cancellationToken), cancellationToken);
    }

    public Task<AuditVerification> VerifyAsync(Actor actor, CancellationToken cancellationToken)
    {
        RequireAdministrator(actor);
        return work.ReadAsync(db => AuditTrail.VerifyAsync(db, cancellationToken), cancellationToken);
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
