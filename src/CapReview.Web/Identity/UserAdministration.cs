using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>A user as the administrator sees them.</summary>
public sealed record UserSummary(string Id, string Email, string DisplayName, IReadOnlyList<string> Roles, bool LockedOut, bool TwoStep);

/// <summary>
/// Users and roles for administrators. Each operation runs in a scope of its own, so that no page holds Identity's
/// DbContext for the life of a circuit.
/// </summary>
public sealed class UserAdministration(IServiceScopeFactory scopes, ReviewWork work, CapReview.Reviews.Audit.AuditTrail audit)
{
    public async Task<IReadOnlyList<UserSummary>> ListAsync(Actor actor, CancellationToken cancellationToken)
    {
        Require(actor);
        using IServiceScope scope = scopes.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
        var all = await users.Users.OrderBy(u => u.Email).ToListAsync(cancellationToken).ConfigureAwait(false);
        var result = new List<UserSummary>();
        foreach (CapReviewUser user in all)
        {
            var roles = await users.GetRolesAsync(user).ConfigureAwait(false);
            result.Add(new UserSummary(user.Id, user.Email ?? "", user.DisplayName, [.. roles.Order(StringComparer.Ordinal)],
                user.LockoutEnd is { } end && end > DateTimeOffset.UtcNow, user.TwoFactorEnabled));
        }
        return result;
    }

    /// <summary>Creates a user with one role; Identity's reasons for refusing (password rules, a taken email) are shown.</summary>
    public async Task CreateAsync(Actor actor, string email, string displayName, string password, string role)
    {
        Require(actor);
        if (!RoleNames.All.Contains(role))
        {
            throw new RuleViolationException("Choose one of the roles.");
        }
        if (string.IsNullOrWhiteSpace(displayName))
        {
            throw new RuleViolationException("Give the person's name.");
        }
        using IServiceScope scope = scopes.CreateScope();
        CapReviewUser user;
        try
        {
            user = await scope.ServiceProvider.GetRequiredService<IdentityStore>().CreateUserAsync(email.Trim(), displayName.Trim(), password, [role]).ConfigureAwait(false);
            await FirstPassword.RequireChangeAsync(scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>(), user).ConfigureAwait(false);
        }
        catch (InvalidOperationException ex)
        {
            throw new RuleViolationException(ex.Message);
        }
        // Who may sign in, and as what, belongs in the same trail as every other change.
        await work.RunAsync(async db =>
        {
            await audit.AppendAsync(db, actor, "user.created", "user", user.Id, null, new { user.Email, user.DisplayName, Role = role }, CancellationToken.None).ConfigureAwait(false);
            return true;
        }, CancellationToken.None).ConfigureAwait(false);
    }

    /// <summary>For a lost phone: two-step sign-in off and a new key; the person sets the app up again at their next sign-in.</summary>
    public async Task ResetTwoStepAsync(Actor actor, string userId)
    {
        Require(actor);
        using IServiceScope scope = scopes.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
        CapReviewUser user = await users.FindByIdAsync(userId).ConfigureAwait(false) ?? throw new NotFoundException("There is no such user.");
        await scope.ServiceProvider.GetRequiredService<TwoStepSignIn>().ResetAsync(user, actor.UserId).ConfigureAwait(false);
        await work.RunAsync(async db =>
        {
            await audit.AppendAsync(db, actor, "user.two-step-reset", "user", user.Id, null, new { user.Email }, CancellationToken.None).ConfigureAwait(false);
            return true;
        }, CancellationToken.None).ConfigureAwait(false);
    }

    private static void Require(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can manage users.");
        }
    }
}
