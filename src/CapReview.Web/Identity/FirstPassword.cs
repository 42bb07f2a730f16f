using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// A password an administrator gave is for the first sign-in only: the account is marked until its owner chooses a
/// password of their own, and the sign-in cookie carries the mark so no page needs to look it up.
/// </summary>
public static class FirstPassword
{
    public const string Claim = "capreview:first-password";
    private const string LoginProvider = "CapReview";
    private const string Name = "PasswordChangeRequired";

    public static Task<IdentityResult> RequireChangeAsync(UserManager<CapReviewUser> users, CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(users);
        return users.SetAuthenticationTokenAsync(user, LoginProvider, Name, "1");
    }

    public static async Task<bool> IsPendingAsync(UserManager<CapReviewUser> users, CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(users);
        return await users.GetAuthenticationTokenAsync(user, LoginProvider, Name).ConfigureAwait(false) is not null;
    }

    public static Task<IdentityResult> ClearAsync(UserManager<CapReviewUser> users, CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(users);
        return users.RemoveAuthenticationTokenAsync(user, LoginProvider, Name);
    }
}
