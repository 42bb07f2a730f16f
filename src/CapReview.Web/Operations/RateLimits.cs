using System.Globalization;
using System.Threading.RateLimiting;
using Microsoft.AspNetCore.RateLimiting;

namespace CapReview.Web.Operations;

/// <summary>How many sign-in attempts and API requests one caller may make (section RateLimits).</summary>
public sealed class RateLimitOptions
{
    /// <summary>Sign-in posts a minute from one address; the account lockout after repeated failures comes on top.</summary>
    public int SignInPerMinute { get; set; } = 10;

    /// <summary>API requests a minute from one caller: one API token, one signed-in user, or (neither) one address.</summary>
    public int ApiPerMinute { get; set; } = 6_000;
}

/// <summary>
/// Limits sign-in attempts by address and API requests by caller; everything else is unlimited. A refused request
/// gets 429 with Retry-After (problem details on the API).
/// </summary>
public static class RateLimits
{
    public static IServiceCollection AddCapReviewRateLimits(this IServiceCollection services, IConfiguration configuration)
    {
        var limits = configuration.GetSection("RateLimits").Get<RateLimitOptions>() ?? new RateLimitOptions();
        services.AddRateLimiter(options =>
        {
            options.GlobalLimiter = PartitionedRateLimiter.Create<HttpContext, string>(context =>
            {
                string address = context.Connection.RemoteIpAddress?.ToString() ?? "unknown";
                if (HttpMethods.IsPost(context.Request.Method) && context.Request.Path.StartsWithSegments("/signin"))
                {
                    return RateLimitPartition.GetFixedWindowLimiter("signin:" + address, _ => new FixedWindowRateLimiterOptions
                    {
                        PermitLimit = limits.SignInPerMinute,
                        Window = TimeSpan.FromMinutes(1),
                        QueueLimit = 0,
                    });
                }
                if (context.Request.Path.StartsWithSegments("/api"))
                {
                    // A token caller is known by its token (authentication of tokens happens later, at the endpoint);
                    // a browser by its signed-in user; anyone else by address.
                    string? header = context.Request.Headers.Authorization;
                    string caller = header is not null && header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase)
                        ? "token:" + Identity.ApiTokenService.Hash(header["Bearer ".Length..].Trim())
                        : context.User.Identity?.IsAuthenticated == true ? "user:" + context.User.Identity.Name : "address:" + address;
                    return RateLimitPartition.GetTokenBucketLimiter("api:" + caller, _ => new TokenBucketRateLimiterOptions
                    {
                        TokenLimit = limits.ApiPerMinute,
                        TokensPerPeriod = limits.ApiPerMinute,
                        ReplenishmentPeriod = TimeSpan.FromMinutes(1),
                        QueueLimit = 0,
                    });
                }
                return RateLimitPartition.GetNoLimiter("unlimited");
            });
            options.OnRejected = async (rejected, cancellationToken) =>
            {
                var response = rejected.HttpContext.Response;
                response.StatusCode = StatusCodes.Status429TooManyRequests;
                TimeSpan wait = rejected.Lease.TryGetMetadata(MetadataName.RetryAfter, out TimeSpan after) ? after : TimeSpan.FromMinutes(1);
                response.Headers.RetryAfter = ((int)Math.Ceiling(wait.TotalSeconds)).ToString(CultureInfo.InvariantCulture);
                if (rejected.HttpContext.Request.Path.StartsWithSegments("/api"))
                {
                    await Results.Problem("Too many requests from this caller; wait and try again.", statusCode: StatusCodes.Status429TooManyRequests)
                        .ExecuteAsync(rejected.HttpContext).ConfigureAwait(false);
                }
                else
                {
                    await response.WriteAsync("Too many sign-in attempts from this address; wait a minute and try again.", cancellationToken).ConfigureAwait(false);
                }
            };
        });
        return services;
    }
}
