using System.Net;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;

namespace CapReview.Web.Tests.Operations;

/// <summary>The database missing at start: the app still starts, says so plainly with 503, fails readiness, and serves once the database is there.</summary>
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
}
