using System.Net;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// Makes every request arrive from <paramref name="address"/>, before the app's own pipeline runs, as a connection
/// from that address would (the test server gives none).
/// </summary>
public sealed class ConnectionFrom(IPAddress address) : IStartupFilter
{
    public Action<IApplicationBuilder> Configure(Action<IApplicationBuilder> next) => app =>
    {
        app.Use((context, following) =>
        {
            context.Connection.RemoteIpAddress = address;
            return following(context);
        });
        next(app);
    };
}
