using System.Globalization;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// How long a browser session lasts: it ends after <see cref="Idle"/> without a request and, however busy, after
/// <see cref="Absolute"/> from the sign-in. Every request with the cookie is checked against the account
/// (<see cref="SessionCheck"/>), so a sign-out, a password change, a disabled account or an administrator's "end
/// sessions" ends it on every device and every app server at its next request. <see cref="StampCheck"/> is how often
/// the cookie's claims (name, roles) are renewed from the account, and how often an open interactive page, which
/// sends no requests, checks its session. Security:IdleMinutes (30), Security:SessionHours (12),
/// Security:SessionCheckSeconds (60): NIST SP 800-63B's AAL2.
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

    /// <summary>
    /// Ends a session older than <see cref="Absolute"/> or one the account no longer stands behind (checked on every
    /// request, not only every <see cref="StampCheck"/>), then lets Identity renew the claims when that is due.
    /// </summary>
    public async Task OnValidatePrincipal(CookieValidatePrincipalContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        if (context.HttpContext.Request.Path.StartsWithSegments("/health"))
        {
            // The probes answer anyone and must not wait on the database: no one is signed in on them (the cookie stays).
            context.RejectPrincipal();
            return;
        }
        bool expired = !context.Properties.Items.TryGetValue(SignedInAt, out string? at)
            || !DateTimeOffset.TryParse(at, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind, out DateTimeOffset since)
            || context.Options.TimeProvider!.GetUtcNow() - since > Absolute;
        var users = context.HttpContext.RequestServices.GetRequiredService<UserManager<CapReviewUser>>();
        if (expired || context.Principal is null || !await SessionCheck.StandsAsync(users, context.Principal).ConfigureAwait(false))
        {
            context.RejectPrincipal();
            await context.HttpContext.SignOutAsync(context.Scheme.Name).ConfigureAwait(false);
            return;
        }
        await SecurityStampValidator.ValidatePrincipalAsync(context).ConfigureAwait(false);
    }
}
