using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Organisation;

/// <summary>Reads the organisation profile.</summary>
public sealed class OrganisationQueries(IDbContextFactory<CapReviewDbContext> contexts)
{
    public async Task<OrganisationProfile?> GetAsync(CancellationToken cancellationToken)
    {
        await using CapReviewDbContext db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        return await db.Organisations.AsNoTracking().SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false);
    }
}
