using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>A user as the administrator sees them.</summary>
public sealed record UserSummary(string Id, string Email, string DisplayName, IReadOnlyList<string> Roles, bool LockedOut, bool TwoStep)
{
    /// <summary>Locked out for good by an administrator, rather than for a few minutes after failed sign-ins.</summary>
    public bool Disabled { get; init; }
}

/// <summary>
/// Users and roles for administrators. Each operation runs in a scope of its own, so that no page holds Identity's
/// DbContext for the life of a circuit.
/// </summary>
public sealed class UserAdministration(IServiceScopeFactory scopes, ReviewWork work, CapReview.Reviews.Audit.AuditTrail audit, ApiTokenCache tokens)
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
                user.LockoutEnd is { } end && end > DateTimeOffset.UtcNow, user.TwoFactorEnabled) { Disabled = user.LockoutEnd == DateTimeOffset.MaxValue });
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

    /// <summary>
    /// Gives a person the roles chosen (at least one). Their sessions end (a new security stamp: the sign-in cookie
    /// carries the roles it was issued with, so the person signs in again and works in the new roles) and their API
    /// tokens answer in the new roles at once. The last administrator who can sign in keeps that role, so that someone
    /// can always manage the installation. Audited with the roles before and after.
    /// </summary>
    public async Task<IReadOnlyList<string>> SetRolesAsync(Actor actor, string userId, IReadOnlyCollection<string> roles)
    {
        Require(actor);
        ArgumentNullException.ThrowIfNull(roles);
        if (roles.Count == 0 || roles.Any(r => !RoleNames.All.Contains(r)))
        {
            throw new RuleViolationException("roles: choose at least one of the roles.");
        }
        string[] wanted = [.. RoleNames.All.Where(roles.Contains)];
        using IServiceScope scope = scopes.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
        CapReviewUser user = await users.FindByIdAsync(userId).ConfigureAwait(false) ?? throw new NotFoundException("There is no such user.");
        string[] before = [.. RoleNames.All.Where((await users.GetRolesAsync(user).ConfigureAwait(false)).Contains)];
        if (before.SequenceEqual(wanted))
        {
            throw new RuleViolationException($"roles: {user.DisplayName} has these roles already.");
        }
        if (before.Contains(RoleNames.Administrator) && !wanted.Contains(RoleNames.Administrator))
        {
            var administrators = await users.GetUsersInRoleAsync(RoleNames.Administrator).ConfigureAwait(false);
            if (!administrators.Any(a => a.Id != user.Id && a.LockoutEnd != DateTimeOffset.MaxValue))
            {
                throw new RuleViolationException($"roles: {user.DisplayName} is the last administrator; make someone else an administrator first.");
            }
        }
        IdentityResult result = await users.RemoveFromRolesAsync(user, before.Except(wanted)).ConfigureAwait(false);
        if (result.Succeeded)
        {
            result = await users.AddToRolesAsync(user, wanted.Except(before)).ConfigureAwait(false);
        }
        if (!result.Succeeded)
        {
            throw new RuleViolationException(string.Join(" ", result.Errors.Select(e => e.Description)));
        }
        await users.UpdateSecurityStampAsync(user).ConfigureAwait(false);
        tokens.Forget();
        await work.RunAsync(async db =>
        {
            await audit.AppendAsync(db, actor, "user.roles-changed", "user", user.Id, new { Roles = before }, new { Roles = wanted }, CancellationToken.None).ConfigureAwait(false);
            return true;
        }, CancellationToken.None).ConfigureAwait(false);
        return wanted;
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

    /// <summary>
    /// For a forgotten password: a new first password, random (20 letters and digits from a CSPRNG, about 100 bits),
    /// shown once to the administrator to hand over; the person must replace it at their next sign-in. Two-step
    /// sign-in stays as it was, so the reset does not get round it. Every session of the account ends.
    /// </summary>
    public async Task<string> ResetPasswordAsync(Actor actor, string userId)
    {
        string first = System.Security.Cryptography.RandomNumberGenerator.GetString("abcdefghijkmnpqrstuvwxyz23456789", 20);
        await ChangeAsync(actor, userId, "user.password-reset", async (users, user) =>
        {
            IdentityResult removed = await users.RemovePasswordAsync(user).ConfigureAwait(false);
            if (!removed.Succeeded)
            {
                return removed;
            }
            IdentityResult added = await users.AddPasswordAsync(user, first).ConfigureAwait(false);
            return added.Succeeded ? await FirstPassword.RequireChangeAsync(users, user).ConfigureAwait(false) : added;
        }).ConfigureAwait(false);
        return first;
    }

    /// <summary>Ends every session of the user on every device (at its next request; an open page within Security:SessionCheckSeconds); they sign in again.</summary>
    public Task EndSessionsAsync(Actor actor, string userId) => ChangeAsync(actor, userId, "user.sessions-ended", users => Task.FromResult(IdentityResult.Success));

    /// <summary>
    /// A disabled account cannot sign in, its sessions end and its API tokens are refused (within the token cache's
    /// 30 seconds); enabling it again lets the person sign in with their password. Administrators cannot disable themselves.
    /// </summary>
    public Task SetDisabledAsync(Actor actor, string userId, bool disabled)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (disabled && actor.UserId == userId)
        {
            throw new RuleViolationException("You cannot disable your own account; ask another administrator.");
        }
        return ChangeAsync(actor, userId, disabled ? "user.disabled" : "user.enabled", async (users, user) =>
        {
            await users.SetLockoutEnabledAsync(user, true).ConfigureAwait(false);
            return await users.SetLockoutEndDateAsync(user, disabled ? DateTimeOffset.MaxValue : null).ConfigureAwait(false);
        });
    }

    private Task ChangeAsync(Actor actor, string userId, string action, Func<UserManager<CapReviewUser>, Task<IdentityResult>> change) =>
        ChangeAsync(actor, userId, action, (users, _) => change(users));

    /// <summary>One change to an account, then a new security stamp (so its sessions end) and an audit event.</summary>
    private async Task ChangeAsync(Actor actor, string userId, string action, Func<UserManager<CapReviewUser>, CapReviewUser, Task<IdentityResult>> change)
    {
        Require(actor);
        using IServiceScope scope = scopes.CreateScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
        CapReviewUser user = await users.FindByIdAsync(userId).ConfigureAwait(false) ?? throw new NotFoundException("There is no such user.");
        IdentityResult result = await change(users, user).ConfigureAwait(false);
        if (!result.Succeeded)
        {
            throw new RuleViolationException(string.Join(" ", result.Errors.Select(e => e.Description)));
        }
        await users.UpdateSecurityStampAsync(user).ConfigureAwait(false);
        // A disabled account's tokens are refused at once here (other servers within the cache's 30 seconds).
        tokens.Forget();
        await work.RunAsync(async db =>
        {
            await audit.AppendAsync(db, actor, action, "user", user.Id, null, new { user.Email }, CancellationToken.None).ConfigureAwait(false);
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
