namespace CapReview.Web.Operations;

/// <summary>
/// Downloads outside /api/v1 (packets, exports) are followed from pages as well as fetched with a token. A person whose
/// browser follows one to something missing gets the app's own not-found page: the problem details a program reads
/// become a bare 404, which the status-code pages turn into that page. A program, which does not ask for HTML, keeps
/// the problem details.
/// </summary>
public static class PageNotFound
{
    public static TBuilder ShowsThePageWhenMissing<TBuilder>(this TBuilder builder) where TBuilder : IEndpointConventionBuilder =>
        builder.AddEndpointFilter(async (context, next) =>
        {
            object? result = await next(context).ConfigureAwait(false);
            return result is IStatusCodeHttpResult { StatusCode: StatusCodes.Status404NotFound } && AsksForAPage(context.HttpContext.Request)
                ? Results.NotFound()
                : result;
        });

    /// <summary>A browser's navigation asks for HTML and sends no API token; HttpClient and scripts do neither.</summary>
    private static bool AsksForAPage(HttpRequest request) =>
        !Identity.IdentityRegistration.IsMachineReadable(request.HttpContext)
        && request.Headers.Accept.Any(a => a is not null && a.Contains("text/html", StringComparison.OrdinalIgnoreCase));
}
