using System.Net;
using CapReview.Web.Tests.Api;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// The database missing at start, or lost while the app runs: the app says so plainly with 503 (a page, or problem
/// details for the API), fails readiness, and serves again once the database is back, without a restart.
/// </summary>
public sealed class DatabaseOutageTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task Without_its_database_the_app_answers_503_and_recovers_when_the_database_returns()
    {
        // A SQLite file in a folder that does not exist yet: SQLite cannot open it, as if the server were down.
        string folder = Path.Combine(Path.GetTempPath(), "capreview-outage-" + Guid.NewGuid().ToString("N"));
        string file = Path.Combine(folder, "capreview.db");
        using var outage = factory.WithWebHostBuilder(builder =>
        {
            builder.UseSetting("Storage:Provider", "Sqlite");
            builder.UseSetting("ConnectionStrings:CapReview", $"Data Source={file};Mode=ReadWriteCreate;Pooling=False");
            builder.UseSetting("Storage:RetrySeconds", "1");
        });
        try
        {
            using HttpClient client = outage.CreateClient(new Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
            using (var page = await client.GetAsync("/signin"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, page.StatusCode);
                Assert.Contains("cannot reach its database", await page.Content.ReadAsStringAsync(), StringComparison.Ordinal);
            }
            using (var api = await client.GetAsync("/api/v1/cycles"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, api.StatusCode);
                Assert.Equal("application/problem+json", api.Content.Headers.ContentType!.MediaType);
            }
            using (var ready = await client.GetAsync("/health/ready"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, ready.StatusCode);
            }
            using (var live = await client.GetAsync("/health/live"))
            {
                Assert.Equal(HttpStatusCode.OK, live.StatusCode);
            }

            // The database comes back: within a few retries the app is ready and serves pages.
            Directory.CreateDirectory(folder);
            HttpStatusCode status = HttpStatusCode.ServiceUnavailable;
            for (int k = 0; k < 60 && status != HttpStatusCode.OK; k++)
            {
                await Task.Delay(250);
                using var again = await client.GetAsync("/health/ready");
                status = again.StatusCode;
            }
            Assert.Equal(HttpStatusCode.OK, status);
            using var signin = await client.GetAsync("/signin");
            Assert.Equal(HttpStatusCode.OK, signin.StatusCode);
        }
        finally
        {
            if (Directory.Exists(folder))
            {
                Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
                Directory.Delete(folder, recursive: true);
            }
        }
    }

    [Fact]
    public async Task Losing_its_database_mid_run_gives_503_and_failed_readiness_and_the_app_recovers_when_it_returns()
    {
        await using var database = SeverableDatabase.Create(factory.Database);
        using var app = factory.WithWebHostBuilder(builder =>
        {
            builder.UseSetting("Storage:Provider", database.Settings.Provider.ToString());
            builder.UseSetting("ConnectionStrings:CapReview", database.Settings.ConnectionString);
            // The production pipeline, with its error page, so the answer is the one users would see.
            builder.UseEnvironment("Production");
            // The outage is under test here, not the sign-in: a password alone may open the pages.
            builder.UseSetting("Security:RequireTwoFactor", "false");
        });
        using (var scope = app.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<IdentityStore>().CreateUserAsync("outage.lead@tarnby.example", "Outage Lead", "outage-tests-2027", [RoleNames.ProjectLead]);
        }
        // Over HTTPS, as production's cookies are sent over nothing else.
        using HttpClient browser = app.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true, BaseAddress = new Uri("https://localhost") });
        using (var signedIn = await FormSignIn.PostAsync(browser, "outage.lead@tarnby.example", "outage-tests-2027"))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }
        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        }

        database.Cut();
        try
        {
            using (var page = await browser.GetAsync("/proposals"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, page.StatusCode);
                Assert.Contains("cannot reach its database", await page.Content.ReadAsStringAsync(), StringComparison.Ordinal);
                Assert.Equal("10", page.Headers.GetValues("Retry-After").Single());
            }
            using (var api = await browser.GetAsync("/api/v1/proposals"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, api.StatusCode);
                Assert.Equal("application/problem+json", api.Content.Headers.ContentType!.MediaType);
            }
            using (var ready = await browser.GetAsync("/health/ready"))
            {
                Assert.Equal(HttpStatusCode.ServiceUnavailable, ready.StatusCode);
                // The probe names no server, file or credential.
                string body = await ready.Content.ReadAsStringAsync();
                Assert.DoesNotContain("capreview.db", body, StringComparison.Ordinal);
                Assert.DoesNotContain("Password", body, StringComparison.OrdinalIgnoreCase);
            }
            using (var live = await browser.GetAsync("/health/live"))
            {
                Assert.Equal(HttpStatusCode.OK, live.StatusCode);
            }
        }
        finally
        {
            database.Restore();
        }

        // Back: the same signed-in session carries on, nothing restarted.
        HttpStatusCode status = HttpStatusCode.ServiceUnavailable;
        for (int k = 0; k < 40 && status != HttpStatusCode.OK; k++)
        {
            using var ready = await browser.GetAsync("/health/ready");
            status = ready.StatusCode;
            if (status != HttpStatusCode.OK)
            {
                await Task.Delay(250);
            }
        }
        Assert.Equal(HttpStatusCode.OK, status);
        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        }
    }
}
