using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>Brings the user store to its latest migration, makes sure the roles exist, and creates users.</summary>
public sealed class IdentityStore(
    IDbContextFactory<CapReviewIdentityDbContext> contexts,
    UserManager<CapReviewUser> users,
    RoleManager<IdentityRole> roles)
{
    public async Task InitializeAsync(CancellationToken cancellationToken)
    {
        await using (var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false))
        {
            await db.Database.MigrateAsync(cancellationToken).ConfigureAwait(false);
        }
        foreach (string role in RoleNames.All)
        {
            if (!await roles.RoleExistsAsync(role).ConfigureAwait(false))
            {
                Check(await roles.CreateAsync(new IdentityRole(role)).ConfigureAwait(false));
            }
        }
    }

    public Task<bool> AnyUserAsync(CancellationToken cancellationToken) => users.Users.AnyAsync(cancellationToken);

    /// <summary>Creates a user with the given roles; every reason it cannot is reported together.</summary>
    public async Task<CapReviewUser> CreateUserAsync(string email, string displayName, string password, IEnumerable<string> roleNames)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(email);
        var user = new CapReviewUser { UserName = email, Email = email, EmailConfirmed = true, DisplayName = displayName };
        Check(await users.CreateAsync(user, password).ConfigureAwait(false));
        Check(await users.AddToRolesAsync(user, roleNames).ConfigureAwait(false));
        return user;
    }

    public Task<CapReviewUser?> FindByEmailAsync(string email) => users.FindByEmailAsync(email);

    private static void Check(IdentityResult result)
    {
        if (!result.Succeeded)
        {
            throw new InvalidOperationException(string.Join(" ", result.Errors.Select(e => e.Description)));
        }
    }
}
