using System.Text;
using Microsoft.AspNetCore.Identity;
using QRCoder;

namespace CapReview.Web.Identity;

/// <summary>
/// Two-step sign-in with an authenticator app (time-based one-time codes, RFC 6238, 30-second steps, six digits, as
/// ASP.NET Core Identity checks them), and recovery codes for a lost phone. Security:RequireTwoFactor makes it
/// required for every browser sign-in (the default outside development).
/// </summary>
public sealed partial class TwoStepSignIn(UserManager<CapReviewUser> users, IUserStore<CapReviewUser> store, IConfiguration configuration, ILogger<TwoStepSignIn> log)
{
    public const int RecoveryCodeCount = 10;

    public bool Required => IsRequired(configuration);

    public static bool IsRequired(IConfiguration configuration) => configuration.GetValue("Security:RequireTwoFactor", true);

    /// <summary>The user's authenticator key, made on first use, grouped for typing, and the otpauth address a QR code carries.</summary>
    public async Task<(string Key, string Uri)> KeyAsync(CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(user);
        string? key = await users.GetAuthenticatorKeyAsync(user).ConfigureAwait(false);
        if (string.IsNullOrEmpty(key))
        {
            // Set without renewing the security stamp, which would end the sign-in this page is shown in.
            key = users.GenerateNewAuthenticatorKey();
            await ((IUserAuthenticatorKeyStore<CapReviewUser>)store).SetAuthenticatorKeyAsync(user, key, CancellationToken.None).ConfigureAwait(false);
            await users.UpdateAsync(user).ConfigureAwait(false);
        }
        string label = Uri.EscapeDataString("CapReview:" + (user.Email ?? user.UserName));
        return (Grouped(key), $"otpauth://totp/{label}?secret={key}&issuer=CapReview&digits=6&period=30");
    }

    /// <summary>Turns two-step sign-in on when the code matches the key; the new recovery codes, or null for a wrong code.</summary>
    public async Task<IReadOnlyList<string>?> EnableAsync(CapReviewUser user, string code)
    {
        ArgumentNullException.ThrowIfNull(user);
        if (!await VerifyAsync(user, code).ConfigureAwait(false))
        {
            return null;
        }
        await users.SetTwoFactorEnabledAsync(user, true).ConfigureAwait(false);
        Enabled(log, user.Id);
        return [.. await users.GenerateNewTwoFactorRecoveryCodesAsync(user, RecoveryCodeCount).ConfigureAwait(false) ?? []];
    }

    /// <summary>New recovery codes (the old ones stop working) when the code matches; null otherwise.</summary>
    public async Task<IReadOnlyList<string>?> RenewRecoveryCodesAsync(CapReviewUser user, string code)
    {
        ArgumentNullException.ThrowIfNull(user);
        if (!user.TwoFactorEnabled || !await VerifyAsync(user, code).ConfigureAwait(false))
        {
            return null;
        }
        RecoveryRenewed(log, user.Id);
        return [.. await users.GenerateNewTwoFactorRecoveryCodesAsync(user, RecoveryCodeCount).ConfigureAwait(false) ?? []];
    }

    /// <summary>An administrator's reset for a lost phone: two-step sign-in off and a new key, so the old phone's codes no longer work.</summary>
    public async Task ResetAsync(CapReviewUser user, string administratorId)
    {
        ArgumentNullException.ThrowIfNull(user);
        await users.SetTwoFactorEnabledAsync(user, false).ConfigureAwait(false);
        await users.ResetAuthenticatorKeyAsync(user).ConfigureAwait(false);
        Reset(log, user.Id, administratorId);
    }

    /// <summary>The QR code of an address as SVG markup (no script, no style: the page's Content-Security-Policy allows it).</summary>
    public static string QrSvg(string uri)
    {
        using var generator = new QRCodeGenerator();
        using QRCodeData data = generator.CreateQrCode(uri, QRCodeGenerator.ECCLevel.M);
        return new SvgQRCode(data).GetGraphic(4);
    }

    private Task<bool> VerifyAsync(CapReviewUser user, string code) =>
        users.VerifyTwoFactorTokenAsync(user, users.Options.Tokens.AuthenticatorTokenProvider, Normalise(code));

    public static string Normalise(string code) => (code ?? "").Replace(" ", "", StringComparison.Ordinal).Replace("-", "", StringComparison.Ordinal);

    private static string Grouped(string key)
    {
        var text = new StringBuilder();
        for (int k = 0; k < key.Length; k += 4)
        {
            text.Append(key.AsSpan(k, Math.Min(4, key.Length - k))).Append(' ');
        }
        return text.ToString().TrimEnd().ToLowerInvariant();
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Two-step sign-in turned on for user {UserId}.")]
    private static partial void Enabled(ILogger logger, string userId);

    [LoggerMessage(Level = LogLevel.Information, Message = "New recovery codes made for user {UserId}.")]
    private static partial void RecoveryRenewed(ILogger logger, string userId);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Two-step sign-in reset for user {UserId} by administrator {AdministratorId}.")]
    private static partial void Reset(ILogger logger, string userId, string administratorId);
}
