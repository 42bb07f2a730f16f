using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>Sign-out as a form post (the sign-in form is the /signin page).</summary>
public static class AccountEndpoints
{
    public static IEndpointRouteBuilder MapAccountEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/signout", async (HttpContext context, IAntiforgery antiforgery, SignInManager<CapReviewUser> signIn) =>
        {
            // Only the app's own form may sign a user out: a forged cross-site post is refused.
            if (!await antiforgery.IsRequestValidAsync(context).ConfigureAwait(false))
            {
                return Results.Text("This sign-out did not come from a CapReview page.", statusCode: StatusCodes.Status400BadRequest);
            }
            await signIn.SignOutAsync().ConfigureAwait(false);
            return Results.LocalRedirect("~/signin");
        }).DisableAntiforgery().ExcludeFromDescription();
        return routes;
    }
}
