using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// Where Security:RequireTwoFactor holds, a browser session signed in with a password alone reaches only the account
/// page (to set up the authenticator app), the sign-in and sign-out, and the static files; every other page sends it
/// to the account page and the API answers 403. API tokens are a separate pathway (docs/security.md).
/// </summary>
public static class TwoStepRequirement
{
    private static readonly string[] Open = ["/account", "/signin", "/signout", "/health", "/not-found", "/denied", "/error", "/_framework", "/_content"];

    public static IApplicationBuilder UseTwoStepRequirement(this IApplicationBuilder app, IConfiguration configuration)
    {
        ArgumentNullException.ThrowIfNull(app);
        if (!TwoStepSignIn.IsRequired(configuration))
        {
            return app;
        }
        return app.Use(async (context, next) =>
        {
            var identity = context.User.Identity;
            bool passwordOnly = identity is { IsAuthenticated: true, AuthenticationType: var scheme } && scheme == IdentityConstants.ApplicationScheme
                && !context.User.HasClaim("amr", "mfa");
            if (!passwordOnly || Open.Any(p => context.Request.Path.StartsWithSegments(p, StringComparison.OrdinalIgnoreCase))
                || Path.HasExtension(context.Request.Path.Value))
            {
                await next(context).ConfigureAwait(false);
                return;
            }
            if (IdentityRegistration.IsMachineReadable(context))
            {
                await Results.Problem("This installation requires two-step sign-in: set up an authenticator app on your account page first.",
                    statusCode: StatusCodes.Status403Forbidden, title: "Two-step sign-in required.").ExecuteAsync(context).ConfigureAwait(false);
                return;
            }
            context.Response.Redirect(context.Request.PathBase + "/account");
        });
    }
}
