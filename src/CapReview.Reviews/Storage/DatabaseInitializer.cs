using CapReview.Reviews.Organisation;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Storage;

/// <summary>Brings the database to the latest migration and, on an empty one, writes the organisation profile.</summary>
public sealed class DatabaseInitializer(IDbContextFactory<CapReviewDbContext> contexts)
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
    }
}
