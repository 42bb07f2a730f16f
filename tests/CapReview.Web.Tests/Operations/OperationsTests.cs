using System.Net;
using System.Text.Json;
using CapReview.Reviews.Storage;
using CapReview.Web.Operations;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace CapReview.Web.Tests.Operations;

public sealed class OperationsTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task Liveness_and_readiness_answer_anonymous_probes_with_the_database_checked()
    {
        using HttpClient client = factory.CreateClient();
        using var live = await client.GetAsync("/health/live");
        Assert.Equal(HttpStatusCode.OK, live.StatusCode);
        using var ready = await client.GetAsync("/health/ready");
        Assert.Equal(HttpStatusCode.OK, ready.StatusCode);
        using JsonDocument body = JsonDocument.Parse(await ready.Content.ReadAsStringAsync());
        Assert.Equal("Healthy", body.RootElement.GetProperty("status").GetString());
        Assert.Equal("Healthy", body.RootElement.GetProperty("checks").GetProperty("database").GetProperty("status").GetString());
    }

    private sealed class Unreachable : IDbContextFactory<CapReviewDbContext>
    {
        public CapReviewDbContext CreateDbContext() => new(new DbContextOptionsBuilder<CapReviewDbContext>()
            .UseNpgsql("Host=127.0.0.1;Port=1;Database=none;Username=none;Password=none;Timeout=2").Options);
    }

    [Fact]
    public async Task Readiness_fails_with_a_plain_reason_when_the_database_cannot_be_reached()
    {
        var result = await new DatabaseHealthCheck(new Unreachable()).CheckHealthAsync(new HealthCheckContext());
        Assert.Equal(HealthStatus.Unhealthy, result.Status);
        // CanConnect answers no rather than throwing; either way the reason names no server or credential.
        Assert.Equal("The database does not answer.", result.Description);
    }

    [Theory]
    [InlineData("/signin")]
    [InlineData("/api/v1/cycles")]
    [InlineData("/health/ready")]
    public async Task Every_answer_carries_the_security_headers_and_its_request_id(string path)
    {
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using var response = await client.GetAsync(path);
        Assert.Equal(SecurityHeaders.ContentSecurityPolicy, response.Headers.GetValues("Content-Security-Policy").Single());
        Assert.Contains("frame-ancestors 'none'", SecurityHeaders.ContentSecurityPolicy, StringComparison.Ordinal);
        Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
        Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        Assert.Equal("same-origin", response.Headers.GetValues("Referrer-Policy").Single());
        Assert.Matches("^[0-9a-f]{32}$", response.Headers.GetValues("X-Request-Id").Single());
    }

    [Fact]
    public async Task Sign_in_posts_beyond_the_limit_from_one_address_are_refused_with_429()
    {
        using var limited = factory.WithWebHostBuilder(builder => builder.UseSetting("RateLimits:SignInPerMinute", "10"));
        using HttpClient client = limited.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        var statuses = new List<HttpStatusCode>();
        for (int k = 0; k < 12; k++)
        {
            using var form = new FormUrlEncodedContent(new Dictionary<string, string> { ["Input.Email"] = "nobody@example.test", ["Input.Password"] = "wrong-password-1" });
            using var response = await client.PostAsync("/signin", form);
            statuses.Add(response.StatusCode);
            if (response.StatusCode == HttpStatusCode.TooManyRequests)
            {
                Assert.True(int.Parse(response.Headers.GetValues("Retry-After").Single(), System.Globalization.CultureInfo.InvariantCulture) > 0);
            }
        }
        // Ten a minute (the default): the first ten reach the form (refused there for want of its token), the rest are not read.
        Assert.All(statuses.Take(10), s => Assert.NotEqual(HttpStatusCode.TooManyRequests, s));
        Assert.All(statuses.Skip(10), s => Assert.Equal(HttpStatusCode.TooManyRequests, s));
    }

    /// <summary>
    /// Every request comes from loopback (as from a proxy on the same host) and names another client in
    /// X-Forwarded-For. Without ReverseProxy:KnownProxies the header is not believed: the three posts count against
    /// loopback's sign-in limit and are logged from 127.0.0.1. With loopback configured as the proxy, each post is its
    /// client's own and is logged from the client's address.
    /// </summary>
    [Theory]
    [InlineData(null)]
    [InlineData("127.0.0.1")]
    public async Task A_forwarded_client_address_is_believed_only_from_a_configured_proxy_never_from_loopback_by_default(string? proxy)
    {
        var logs = new CapReview.Web.Tests.Security.CapturedLogs();
        using var app = factory.WithWebHostBuilder(builder =>
        {
            builder.UseSetting("RateLimits:SignInPerMinute", "2");
            if (proxy is not null)
            {
                builder.UseSetting("ReverseProxy:KnownProxies:0", proxy);
            }
            builder.ConfigureServices(services => services.AddSingleton<ILoggerProvider>(logs));
            builder.ConfigureTestServices(services => services.AddSingleton<IStartupFilter>(new ConnectionFrom(IPAddress.Loopback)));
        });
        using HttpClient client = app.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        var statuses = new List<HttpStatusCode>();
        string[] clients = ["203.0.113.7", "203.0.113.8", "203.0.113.9"];
        foreach (string forwarded in clients)
        {
            using var request = new HttpRequestMessage(HttpMethod.Post, "/signin")
            {
                Content = new FormUrlEncodedContent(new Dictionary<string, string> { ["Input.Email"] = "nobody@example.test", ["Input.Password"] = "wrong-password-1" }),
            };
            request.Headers.Add("X-Forwarded-For", forwarded);
            using var response = await client.SendAsync(request);
            statuses.Add(response.StatusCode);
        }
        // Each post lacks the form's token (400) unless the limit of two a minute from one address refuses it first (429).
        var refused = logs.Entries.Where(e => e.Category == CapReview.Web.Identity.SecurityLog.Category && e.EventId == 110).Select(e => e.Message).ToList();
        if (proxy is null)
        {
            Assert.Equal([HttpStatusCode.BadRequest, HttpStatusCode.BadRequest, HttpStatusCode.TooManyRequests], statuses);
            Assert.Equal(3, refused.Count(m => m.EndsWith("from 127.0.0.1.", StringComparison.Ordinal)));
            Assert.DoesNotContain(refused, m => m.Contains("203.0.113.", StringComparison.Ordinal));
        }
        else
        {
            Assert.Equal([HttpStatusCode.BadRequest, HttpStatusCode.BadRequest, HttpStatusCode.BadRequest], statuses);
            Assert.All(clients, address => Assert.Contains(refused, m => m.EndsWith($"from {address}.", StringComparison.Ordinal)));
        }
    }

    [Fact]
    public async Task A_sign_in_made_by_one_app_server_is_accepted_by_another_on_the_same_database()
    {
        using (var scope = Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.CreateScope(factory.Services))
        {
            var identity = Microsoft.Extensions.DependencyInjection.ServiceProviderServiceExtensions.GetRequiredService<CapReview.Web.Identity.IdentityStore>(scope.ServiceProvider);
            await identity.CreateUserAsync("two.servers@tarnby.example", "Two Servers", "twin-harbour-2027", [CapReview.Web.Identity.RoleNames.ProjectLead]);
        }
        using HttpClient first = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using var signedIn = await CapReview.Web.Tests.Api.FormSignIn.PostAsync(first, "two.servers@tarnby.example", "twin-harbour-2027");
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        string cookie = signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("capreview=", StringComparison.Ordinal)).Split(';')[0];

        // A second app instance: its own host and services, the same database and so the same keys.
        using var second = factory.WithWebHostBuilder(_ => { });
        using HttpClient other = second.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = false });
        using var request = new HttpRequestMessage(HttpMethod.Get, "/proposals");
        request.Headers.Add("Cookie", cookie);
        using var page = await other.SendAsync(request);
        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
    }

    [Fact]
    public async Task Each_evaluation_is_timed_on_the_CapReview_meter()
    {
        var recorded = new List<double>();
        using var listener = new System.Diagnostics.Metrics.MeterListener();
        listener.InstrumentPublished = (instrument, l) =>
        {
            if (instrument.Meter.Name == CapReviewMetrics.MeterName && instrument.Name == "capreview.evaluation.duration")
            {
                l.EnableMeasurementEvents(instrument);
            }
        };
        listener.SetMeasurementEventCallback<double>((_, value, _, _) => { lock (recorded) { recorded.Add(value); } });
        listener.Start();
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        using var content = new StringContent("""{"horizon":2,"rate":{"value":0.1},"elements":[{"type":"single","label":"a","category":"capital","period":0,"amount":-100},{"type":"uniform","label":"b","category":"revenue","first":1,"last":2,"amount":60}]}""", System.Text.Encoding.UTF8, "application/json");
        using var response = await client.PostAsync("/api/v1/evaluations", content);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        lock (recorded)
        {
            Assert.Contains(recorded, v => v > 0 && v < 10_000);
        }
    }

    [Fact]
    public async Task The_API_limit_counts_each_token_on_its_own()
    {
        using var limited = factory.WithWebHostBuilder(builder => builder.UseSetting("RateLimits:ApiPerMinute", "3"));
        async Task<HttpClient> TokenClientAsync(string email)
        {
            var (client, _) = await factory.TokenClientAsync(email, CapReview.Web.Identity.RoleNames.Finance);
            HttpClient other = limited.CreateClient();
            other.DefaultRequestHeaders.Authorization = client.DefaultRequestHeaders.Authorization;
            client.Dispose();
            return other;
        }
        using HttpClient first = await TokenClientAsync("limit.first@tarnby.example");
        using HttpClient second = await TokenClientAsync("limit.second@tarnby.example");
        var statuses = new List<HttpStatusCode>();
        for (int k = 0; k < 4; k++)
        {
            using var response = await first.GetAsync("/api/v1/cycles");
            statuses.Add(response.StatusCode);
        }
        Assert.Equal([HttpStatusCode.OK, HttpStatusCode.OK, HttpStatusCode.OK, HttpStatusCode.TooManyRequests], statuses);
        using var fresh = await second.GetAsync("/api/v1/cycles");
        Assert.Equal(HttpStatusCode.OK, fresh.StatusCode);
    }
}
