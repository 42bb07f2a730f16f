using System.Diagnostics;

namespace CapReview.Web.Operations;

/// <summary>
/// Every response names its request (X-Request-Id: the trace id the logs carry in their scope), so that a user's
/// report, the reverse proxy's log and the app's structured log line up.
/// </summary>
public static class RequestIds
{
    public static IApplicationBuilder UseRequestIds(this IApplicationBuilder app) => app.Use(async (context, next) =>
    {
        string id = Activity.Current?.TraceId.ToString() ?? context.TraceIdentifier;
        context.Response.OnStarting(() =>
        {
            context.Response.Headers["X-Request-Id"] = id;
            return Task.CompletedTask;
        });
        await next(context).ConfigureAwait(false);
    });
}
