using System.Net.Http.Headers;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>The real app in memory, on a temporary database of its own (SQLite, or PostgreSQL: see <see cref="CapReview.TestSupport.TestDatabase"/>).</summary>
public sealed class ApiFactory : WebApplicationFactory<Program>
{
    private readonly string _folder = Directory.CreateTempSubdirectory("capreview-api-").FullName;
    private CapReview.TestSupport.TestDatabase? _database;

    public CapReview.TestSupport.TestDatabase Database => _database ??= CapReview.TestSupport.TestDatabase.Create(Path.Combine(_folder, "capreview.db"));

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.UseSetting("Storage:Provider", Database.Settings.Provider.ToString());
        builder.UseSetting("ConnectionStrings:CapReview", Database.Settings.ConnectionString);
        builder.UseSetting("Demo:Enabled", "false");
        // The tests sign in far more often than a person would; OperationsTests restores the real limit to test it.
        builder.UseSetting("RateLimits:SignInPerMinute", "100000");
    }

    private AuthenticationHeaderValue? _leadToken;

    /// <summary>A client that sends a personal API token of a project lead created for these tests, issued once per factory.</summary>
    public async Task<HttpClient> CreateAuthenticatedClientAsync()
    {
        if (_leadToken is null)
        {
            var (first, _) = await TokenClientAsync("api.tests@tarnby.example", RoleNames.ProjectLead);
            _leadToken = first.DefaultRequestHeaders.Authorization;
            return first;
        }
        HttpClient client = CreateClient();
        client.DefaultRequestHeaders.Authorization = _leadToken;
        return client;
    }

    /// <summary>A client that sends a new personal API token of the user with this e-mail (created with the role when missing), and the user's id.</summary>
    public async Task<(HttpClient Client, string UserId)> TokenClientAsync(string email, string role)
    {
        using var scope = Services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
        var user = await identity.FindByEmailAsync(email) ?? await identity.CreateUserAsync(email, email, "amber-kettle-2027", [role]);
        string token = await scope.ServiceProvider.GetRequiredService<ApiTokenService>().IssueAsync(user.Id, "tests", CancellationToken.None);
        HttpClient client = CreateClient();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        return (client, user.Id);
    }

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            _database?.DisposeAsync().AsTask().GetAwaiter().GetResult();
            try
            {
                Directory.Delete(_folder, recursive: true);
            }
            catch (IOException)
            {
                // Left for the system's temporary-file cleanup.
            }
        }
    }
}
