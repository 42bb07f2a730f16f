using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// A browser session whose account is not set up yet reaches only the account page, the sign-in and sign-out, and
/// the static files; every other page sends it to the account page and the API answers 403. Not set up: signed in
/// with a password alone where Security:RequireTwoFactor holds (the authenticator app is still to be added), or with
/// a first password an administrator gave (still to be changed). API tokens are a separate pathway (docs/security.md).
/// </summary>
public static class AccountSetupRequirement
{
    private static readonly string[] Open = ["/account", "/signin", "/signout", "/health", "/not-found", "/denied", "/error", "/_framework", "/_content"];

    /// <summary>The kinds of static file the pages load (styles, scripts, icons, fonts); not JSON, so not the OpenAPI document.</summary>
    private static readonly string[] StaticFiles = [".css", ".js", ".mjs", ".map", ".svg", ".png", ".ico", ".woff", ".woff2"];

    public static IApplicationBuilder UseAccountSetupRequirement(this IApplicationBuilder app, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(app);
        bool twoStepRequired = TwoStepSignIn.IsRequired(configuration);
        return app.Use(async (context, next) =>
        {
            bool browser = context.User.Identity is { IsAuthenticated: true, AuthenticationType: var scheme } && scheme == IdentityConstants.ApplicationScheme;
            bool unfinished = browser && ((twoStepRequired && !context.User.HasClaim("amr", "mfa")) || context.User.HasClaim(FirstPassword.Claim, "1"));
            if (!unfinished || Open.Any(p => context.Request.Path.StartsWithSegments(p, StringComparison.OrdinalIgnoreCase))
                || (HttpMethods.IsGet(context.Request.Method) && StaticFiles.Contains(Path.GetExtension(context.Request.Path.Value), StringComparer.OrdinalIgnoreCase)))
            {
                await next(context).ConfigureAwait(false);
                return;
            }
            if (IdentityRegistration.IsMachineReadable(context))
            {
                await Results.Problem("Finish setting up your account on its page first (a password of your own, and the authenticator app where two-step sign-in is required).",
                    statusCode: StatusCodes.Status403Forbidden, title: "The account is not set up yet.").ExecuteAsync(context).ConfigureAwait(false);
                return;
            }
            context.Response.Redirect(context.Request.PathBase + "/account");
        });
    }
}
