using Microsoft.AspNetCore.Components.Authorization;
using Microsoft.AspNetCore.Components.Server;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// An open interactive page (its circuit) sends no requests, so it checks its sign-in against the account
/// (<see cref="SessionCheck"/>) every Security:SessionCheckSeconds: after a sign-out elsewhere, a password change, a
/// disabled account or an administrator's "end sessions", the page turns to the sign-in within that time instead of
/// carrying on with the old session.
/// </summary>
public sealed class CircuitSessionCheck(ILoggerFactory loggerFactory, IServiceScopeFactory scopes, SessionLimits limits)
    : RevalidatingServerAuthenticationStateProvider(loggerFactory)
{
    protected override TimeSpan RevalidationInterval => limits.StampCheck > TimeSpan.Zero ? limits.StampCheck : TimeSpan.FromSeconds(1);

    protected override async Task<bool> ValidateAuthenticationStateAsync(AuthenticationState authenticationState, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(authenticationState);
        await using AsyncServiceScope scope = scopes.CreateAsyncScope();
        return await SessionCheck.StandsAsync(scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>(), authenticationState.User).ConfigureAwait(false);
    }
}
