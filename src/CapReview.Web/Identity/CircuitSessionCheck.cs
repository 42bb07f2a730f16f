using System.Security.Claims;
using Microsoft.AspNetCore.Components.Authorization;
using Microsoft.AspNetCore.Components.Server;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>
/// An open interactive page (its circuit) checks its sign-in against the account as often as the cookie does
/// (Security:SessionCheckSeconds): after a sign-out elsewhere, a password change, a disabled account or an
/// administrator's "end sessions", the page turns to the sign-in instead of carrying on with the old session.
/// </summary>
public sealed class CircuitSessionCheck(ILoggerFactory loggerFactory, IServiceScopeFactory scopes, IOptions<IdentityOptions> identity, SessionLimits limits)
    : RevalidatingServerAuthenticationStateProvider(loggerFactory)
{
    protected override TimeSpan RevalidationInterval => limits.StampCheck > TimeSpan.Zero ? limits.StampCheck : TimeSpan.FromSeconds(1);

    protected override async Task<bool> ValidateAuthenticationStateAsync(AuthenticationState authenticationState, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(authenticationState);
        ClaimsPrincipal principal = authenticationState.User;
        await using AsyncServiceScope scope = scopes.CreateAsyncScope();
        var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
        CapReviewUser? user = await users.GetUserAsync(principal).ConfigureAwait(false);
        if (user is null || await users.IsLockedOutAsync(user).ConfigureAwait(false))
        {
            return false;
        }
        string? stamp = principal.FindFirstValue(identity.Value.ClaimsIdentity.SecurityStampClaimType);
        return stamp is not null && stamp == await users.GetSecurityStampAsync(user).ConfigureAwait(false);
    }
}
