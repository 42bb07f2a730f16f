using System.Net;
using System.Net.Http.Headers;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;

namespace CapReview.Web.Tests.Security;

/// <summary>Each security decision reaches the CapReview.Security log with who (account id), what and from where.</summary>
public sealed class SecurityLogTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task Sign_ins_sign_outs_refused_tokens_and_refused_access_are_logged_by_account_id()
    {
        var logs = new CapturedLogs();
        using var app = factory.WithWebHostBuilder(builder => builder.ConfigureServices(services => services.AddSingleton<ILoggerProvider>(logs)));
        await AccountDefenceTests.CreateUserAsync(app.Services, "logged.lead@tarnby.example", "plum-anchor-2027");
        string id;
        using (var scope = app.Services.CreateScope())
        {
            id = (await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("logged.lead@tarnby.example"))!.Id;
        }
        using HttpClient browser = app.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        (await FormSignIn.PostAsync(browser, "nobody.here@tarnby.example", "plum-anchor-2027")).Dispose();
        (await FormSignIn.PostAsync(browser, "logged.lead@tarnby.example", "plum-anchor-2026")).Dispose();
        (await FormSignIn.PostAsync(browser, "logged.lead@tarnby.example", "plum-anchor-2027")).Dispose();
        Assert.Equal(HttpStatusCode.Redirect, (await browser.GetAsync("/admin/users")).StatusCode);
        string page = await browser.GetStringAsync("/proposals");
        (await FormSignIn.PostFormAsync(browser, "/signout", page, null)).Dispose();
        using (var forged = await browser.PostAsync("/signin", new FormUrlEncodedContent(new Dictionary<string, string> { ["_handler"] = "signin", ["Input.Email"] = "x@tarnby.example" })))
        {
            Assert.Equal(HttpStatusCode.BadRequest, forged.StatusCode);
        }
        using HttpClient api = app.CreateClient();
        api.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", "crv_not-a-token");
        Assert.Equal(HttpStatusCode.Unauthorized, (await api.GetAsync("/api/v1/cycles")).StatusCode);

        var security = logs.Entries.Where(e => e.Category == SecurityLog.Category).ToList();
        Assert.Contains(security, e => e.EventId == 101 && e.Message.Contains("no such account", StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 101 && e.Message.Contains($"wrong password) for {id}", StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 100 && e.Message.Contains($"user {id} with password", StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 110 && e.Message.Contains($"403 for GET /admin/users: user {id}", StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 103 && e.Message.Contains(id, StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 110 && e.Message.Contains("401 for GET /api/v1/cycles: user anonymous", StringComparison.Ordinal));
        Assert.Contains(security, e => e.EventId == 110 && e.Message.Contains("400 for POST /signin", StringComparison.Ordinal));
        // What the visitor typed is not logged, not even the e-mail of an unknown account.
        Assert.DoesNotContain(security, e => e.Text.Contains("nobody.here", StringComparison.Ordinal));
    }
}
