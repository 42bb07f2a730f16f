using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// Sign-out as a form post (the sign-in form is the /signin page). It ends the account's sessions on every device
/// (a copied cookie is refused at its next request, on every app server: <see cref="SessionCheck"/>) and tells the
/// browser to forget this site's data.
/// </summary>
public static class AccountEndpoints
{
    public static IEndpointRouteBuilder MapAccountEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/signout", async (HttpContext context, IAntiforgery antiforgery, SignInManager<CapReviewUser> signIn, UserManager<CapReviewUser> users, ILoggerFactory logs) =>
        {
            ILogger log = logs.CreateLogger(SecurityLog.Category);
            // Only the app's own form may sign a user out: a forged cross-site post is refused.
            if (!await antiforgery.IsRequestValidAsync(context).ConfigureAwait(false))
            {
                return Results.Text("This sign-out did not come from a CapReview page.", statusCode: StatusCodes.Status400BadRequest);
            }
            if (await users.GetUserAsync(context.User).ConfigureAwait(false) is { } user)
            {
                await users.UpdateSecurityStampAsync(user).ConfigureAwait(false);
                SecurityLog.SignedOut(log, user.Id);
            }
            await signIn.SignOutAsync().ConfigureAwait(false);
            context.Response.Headers["Clear-Site-Data"] = "\"cache\", \"storage\"";
            return Results.LocalRedirect("~/signin");
        }).DisableAntiforgery().ExcludeFromDescription();
        return routes;
    }
}
