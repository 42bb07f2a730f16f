using System.Security.Claims;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// Whether a signed-in session still stands: its account exists, is neither locked nor disabled, and still carries
/// the security stamp the session was signed in with (a sign-out, a password change, a password or two-step reset
/// and an administrator's "end sessions" each give the account a new one). Read from the database every time, never
/// remembered, so that a session ended on one app server is refused by every other at its next request.
/// </summary>
public static class SessionCheck
{
    public static async Task<bool> StandsAsync(UserManager<CapReviewUser> users, ClaimsPrincipal principal)
    {
        ArgumentNullException.ThrowIfNull(users);
        ArgumentNullException.ThrowIfNull(principal);
        CapReviewUser? user = await users.GetUserAsync(principal).ConfigureAwait(false);
        if (user is null || await users.IsLockedOutAsync(user).ConfigureAwait(false))
        {
            return false;
        }
        string? stamp = principal.FindFirstValue(users.Options.ClaimsIdentity.SecurityStampClaimType);
        return stamp is not null && string.Equals(stamp, await users.GetSecurityStampAsync(user).ConfigureAwait(false), StringComparison.Ordinal);
    }
}
