namespace CapReview.Web.Identity;

/// <summary>
/// The rules every cookie CapReview sets follows (docs/security.md, V3 and V7): outside development the __Host- prefix
/// and HTTPS only, so that no other host or path can set or overwrite it (the app is served from the root of its own
/// host name); always HttpOnly (no script reads it), SameSite=Strict (no other site's page sends it), path / and no
/// domain.
/// </summary>
public static class CookieRules
{
    public static void Apply(CookieBuilder cookie, string name, bool secureCookiesOnly)
    {
        ArgumentNullException.ThrowIfNull(cookie);
        cookie.Name = secureCookiesOnly ? "__Host-" + name : name;
        cookie.SecurePolicy = secureCookiesOnly ? CookieSecurePolicy.Always : CookieSecurePolicy.SameAsRequest;
        cookie.HttpOnly = true;
        cookie.SameSite = SameSiteMode.Strict;
        cookie.Path = "/";
        cookie.Domain = null;
    }
}
