using CapReview.Web.Identity;

namespace CapReview.Web.Api;

/// <summary>What every API route that changes stored state declares and requires, written once.</summary>
internal static class ApiRouteConventions
{
    /// <summary>
    /// A change by a signed-in caller or API token: its answers for a bad body (400), a refused role (403), a missing
    /// record (404) and a conflict with the stored state (409). A token-carrying client sends no antiforgery token,
    /// and a page of another site cannot post here with a person's cookie: these routes read a JSON body only, which
    /// a browser does not send across sites without asking the app first.
    /// </summary>
    public static RouteHandlerBuilder ChangesState(this RouteHandlerBuilder route) => route
        .ProducesValidationProblem()
        .ProducesProblem(StatusCodes.Status403Forbidden)
        .ProducesProblem(StatusCodes.Status404NotFound)
        .ProducesProblem(StatusCodes.Status409Conflict)
        .RequireAuthorization(IdentityRegistration.Api)
        .DisableAntiforgery();
}
