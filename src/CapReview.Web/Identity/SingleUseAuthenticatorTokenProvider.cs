using System.Globalization;
using Microsoft.AspNetCore.Identity;
using OtpNet;

namespace CapReview.Web.Identity;

/// <summary>
/// Checks an authenticator app's code (RFC 6238: HMAC-SHA1, 30-second steps, six digits; the current step and the one
/// before, for the time it takes to type and send a code, RFC 6238 section 5.2) and accepts each code once: the step last accepted is kept with the account, and a code of that
/// step or an earlier one is refused, so a code seen over someone's shoulder cannot be used again.
/// </summary>
public sealed class SingleUseAuthenticatorTokenProvider(TimeProvider clock) : IUserTwoFactorTokenProvider<CapReviewUser>
{
    public const string Name = "CapReviewAuthenticator";
    private const string LoginProvider = "CapReview";
    private const string LastStep = "LastAuthenticatorStep";

    public async Task<bool> CanGenerateTwoFactorTokenAsync(UserManager<CapReviewUser> manager, CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(manager);
        return !string.IsNullOrWhiteSpace(await manager.GetAuthenticatorKeyAsync(user).ConfigureAwait(false));
    }

    /// <summary>The codes come from the person's app; the server never sends one.</summary>
    public Task<string> GenerateAsync(string purpose, UserManager<CapReviewUser> manager, CapReviewUser user) => Task.FromResult("");

    public async Task<bool> ValidateAsync(string purpose, string token, UserManager<CapReviewUser> manager, CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(manager);
        string? key = await manager.GetAuthenticatorKeyAsync(user).ConfigureAwait(false);
        if (string.IsNullOrWhiteSpace(key) || token is not { Length: 6 } || !token.All(char.IsAsciiDigit))
        {
            return false;
        }
        var totp = new Totp(Base32Encoding.ToBytes(key));
        if (!totp.VerifyTotp(clock.GetUtcNow().UtcDateTime, token, out long step, new VerificationWindow(previous: 1, future: 0)))
        {
            return false;
        }
        string? last = await manager.GetAuthenticationTokenAsync(user, LoginProvider, LastStep).ConfigureAwait(false);
        if (last is not null && long.Parse(last, CultureInfo.InvariantCulture) >= step)
        {
            return false;
        }
        IdentityResult kept = await manager.SetAuthenticationTokenAsync(user, LoginProvider, LastStep, step.ToString(CultureInfo.InvariantCulture)).ConfigureAwait(false);
        return kept.Succeeded;
    }
}
