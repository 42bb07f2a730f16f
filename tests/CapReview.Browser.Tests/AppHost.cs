using System.Net;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Browser.Tests;

/// <summary>The real app on Kestrel at a free loopback port, with its own temporary SQLite database.</summary>
public sealed class AppHost : WebApplicationFactory<Program>
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-browser-").FullName;

    public string BaseAddress { get; private set; } = "";

    public void Start()
    {
        UseKestrel(options => options.Listen(IPAddress.Loopback, 0));
        StartServer();
        var addresses = Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!;
        BaseAddress = addresses.Addresses.First().TrimEnd('/') + "/";
    }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.UseSetting("ConnectionStrings:CapReview", $"Data Source={Path.Combine(_folder, "capreview.db")};Pooling=False");
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            try
            {
                Directory.Delete(_folder, recursive: true);
            }
            catch (IOException)
            {
                // A file still held open is left for the system's temporary-file cleanup.
            }
        }
    }
}
