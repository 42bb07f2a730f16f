using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>Sign-out as a form post (the sign-in form is the /signin page).</summary>
public static class AccountEndpoints
{
    public static IEndpointRouteBuilder MapAccountEndpoints(this IEndpointRouteBuilder routes)
    {
        routes.MapPost("/signout", async (SignInManager<CapReviewUser> signIn) =>
        {
            await signIn.SignOutAsync().ConfigureAwait(false);
            return Results.LocalRedirect("~/signin");
        });
        return routes;
    }
}
