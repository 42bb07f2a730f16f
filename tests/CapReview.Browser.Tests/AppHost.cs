using System.Net;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace CapReview.Browser.Tests;

/// <summary>The real app on Kestrel at a free loopback port, with its own temporary SQLite database.</summary>
public sealed class AppHost : WebApplicationFactory<Program>
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-browser-").FullName;

    public string BaseAddress { get; private set; } = "";

    /// <summary>The commands the domain's database receives while the app runs.</summary>
    public DatabaseCommandLog Database { get; } = new();

    /// <summary>What the app logs at warning and above while it runs.</summary>
    public ServerLog Log { get; } = new();

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
        builder.ConfigureLogging(logging => logging.AddProvider(Log));
        builder.UseSetting("ConnectionStrings:CapReview", $"Data Source={Path.Combine(_folder, "capreview.db")};Pooling=False");
        builder.UseSetting("Demo:Enabled", "false");
        builder.ConfigureServices(services => services.ConfigureDbContext<CapReview.Reviews.Storage.CapReviewDbContext>(options => options.AddInterceptors(Database)));
        // The tests sign in far more often than a person would; the limit itself is tested in CapReview.Web.Tests.
        builder.UseSetting("RateLimits:SignInPerMinute", "100000");
        // Open pages check their sessions every second here, so that a session ended elsewhere shows at once.
        builder.UseSetting("Security:SessionCheckSeconds", "1");
    }

    public const string Password = "browser-tests-2027";

    /// <summary>Creates a user with the given role once; signs in with <see cref="Password"/>.</summary>
    public async Task<string> UserAsync(string email, string name, string role)
    {
        using var scope = Services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<CapReview.Web.Identity.IdentityStore>();
        if (await identity.FindByEmailAsync(email) is null)
        {
            await identity.CreateUserAsync(email, name, Password, [role]);
        }
        return email;
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
