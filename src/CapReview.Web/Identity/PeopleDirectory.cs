using CapReview.Reviews.Interchange;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>The installation's users for cycle documents, read from the identity store.</summary>
public sealed class PeopleDirectory(IDbContextFactory<CapReviewIdentityDbContext> contexts) : IPeopleDirectory
{
    public async Task<KnownPerson?> FindAsync(string userId, CancellationToken cancellationToken)
    {
        await using var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        return await db.Users.AsNoTracking().Where(u => u.Id == userId)
            .Select(u => new KnownPerson(u.Id, u.DisplayName, u.Email ?? "")).SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false);
    }

    public async Task<KnownPerson?> FindByEmailAsync(string email, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(email);
        string normalized = email.Trim().ToUpperInvariant();
        await using var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        return await db.Users.AsNoTracking().Where(u => u.NormalizedEmail == normalized)
            .Select(u => new KnownPerson(u.Id, u.DisplayName, u.Email ?? "")).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
    }
}
