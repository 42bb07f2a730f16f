using System.Globalization;

namespace CapReview.Web.Api;

/// <summary>
/// 429 with problem details and Retry-After, for a simulation or solver run refused by the run limits: the caller (or
/// the server) already has as many going as allowed. Runs take seconds, so trying again shortly is the advice.
/// </summary>
public sealed class TooManyRunsResult(string detail) : IResult
{
    /// <summary>Seconds the caller is asked to wait before trying again.</summary>
    public const int RetryAfterSeconds = 10;

    public Task ExecuteAsync(HttpContext httpContext)
    {
        ArgumentNullException.ThrowIfNull(httpContext);
        httpContext.Response.Headers.RetryAfter = RetryAfterSeconds.ToString(CultureInfo.InvariantCulture);
        return Results.Problem(detail, statusCode: StatusCodes.Status429TooManyRequests, title: "Too many simulations or portfolio calculations at once.")
            .ExecuteAsync(httpContext);
    }
}
