using System.Globalization;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;

namespace CapReview.Web.Identity;

/// <summary>
/// How long a browser session lasts: it ends after <see cref="Idle"/> without a request and, however busy, after
/// <see cref="Absolute"/> from the sign-in; every <see cref="StampCheck"/> the session is checked against the account,
/// so a sign-out, a password change, a disabled account or an administrator's "end sessions" ends it on every device.
/// Security:IdleMinutes (30), Security:SessionHours (12), Security:SessionCheckSeconds (60): NIST SP 800-63B's AAL2.
/// </summary>
public sealed record SessionLimits(TimeSpan Idle, TimeSpan Absolute, TimeSpan StampCheck)
{
    private const string SignedInAt = "capreview.signed-in-at";

    public static SessionLimits Read(IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(configuration);
        return new(TimeSpan.FromMinutes(configuration.GetValue("Security:IdleMinutes", 30.0)),
            TimeSpan.FromHours(configuration.GetValue("Security:SessionHours", 12.0)),
            TimeSpan.FromSeconds(configuration.GetValue("Security:SessionCheckSeconds", 60.0)));
    }

    /// <summary>Notes the time of the sign-in once; a sliding renewal of the cookie keeps it.</summary>
    public Task OnSigningIn(CookieSigningInContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (!context.Properties.Items.ContainsKey(SignedInAt))
        {
            context.Properties.Items[SignedInAt] = context.Options.TimeProvider!.GetUtcNow().ToString("O", CultureInfo.InvariantCulture);
        }
        return Task.CompletedTask;
    }

    /// <summary>Ends a session older than <see cref="Absolute"/>, then lets Identity check the account's security stamp.</summary>
    public async Task OnValidatePrincipal(CookieValidatePrincipalContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        bool expired = !context.Properties.Items.TryGetValue(SignedInAt, out string? at)
            || !DateTimeOffset.TryParse(at, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind, out DateTimeOffset since)
            || context.Options.TimeProvider!.GetUtcNow() - since > Absolute;
        if (expired)
        {
            context.RejectPrincipal();
            await context.HttpContext.SignOutAsync(context.Scheme.Name).ConfigureAwait(false);
            return;
        }
        await Microsoft.AspNetCore.Identity.SecurityStampValidator.ValidatePrincipalAsync(context).ConfigureAwait(false);
    }
}
