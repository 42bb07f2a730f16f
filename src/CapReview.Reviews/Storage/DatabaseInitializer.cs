using CapReview.Reviews.Organisation;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>
/// Brings the database to the latest migration, writes the organisation profile on an empty one, and keys an audit
/// chain written before the chain was keyed.
/// </summary>
public sealed class DatabaseInitializer(IDbContextFactory<CapReviewDbContext> contexts, Common.ReviewWork work, Audit.AuditTrail audit)
{
    public async Task InitializeAsync(OrganisationProfile defaults, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(defaults);
        await using CapReviewDbContext db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        await db.Database.MigrateAsync(cancellationToken).ConfigureAwait(false);
        if (!await db.Organisations.AnyAsync(cancellationToken).ConfigureAwait(false))
        {
            db.Organisations.Add(defaults);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
        }
        // The write (and, on PostgreSQL, its lock) only when the newest event has no key: on most starts nothing to do.
        bool unkeyed = await db.AuditEvents.OrderByDescending(e => e.Id).Select(e => e.KeyId == null).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
        if (unkeyed)
        {
            await work.RunAsync(async writer =>
            {
                await audit.SealAsync(writer, cancellationToken).ConfigureAwait(false);
                return true;
            }, cancellationToken).ConfigureAwait(false);
        }
    }
}
