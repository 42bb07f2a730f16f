using System.Net;
using System.Net.Http.Headers;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Operations;

/// <summary>
/// Issue 17: a missing or malformed id in an address a person follows gives the app's own not-found page, in the app's
/// layout and with a 404, never raw JSON or the browser's page; the API keeps its problem details.
/// </summary>
public sealed class NotFoundPageTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Password = "not-found-tests-2027";

    public static TheoryData<string> MissingPages() =>
    [
        "/cycles/abc",
        "/cycles/99999",
        "/cycles/99999/ranking",
        "/cycles/99999/portfolio",
        "/proposals/99999",
        "/proposals/abc",
        "/proposals/99999/replacement",
        "/packets/xyz",
        "/packets/99999",
        "/cycles/99999/ranking/csv",
        "/proposals/99999/versions/1/xlsx",
        "/proposals/99999/versions/1/csv/elements",
        "/no/such/page",
    ];

    [Theory]
    [MemberData(nameof(MissingPages))]
    public async Task A_browser_gets_the_apps_not_found_page_with_its_layout(string path)
    {
        using HttpClient browser = await BrowserAsync(RoleNames.Administrator);
        using HttpResponseMessage response = await browser.GetAsync(path);

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("text/html", response.Content.Headers.ContentType?.MediaType);
        string html = await response.Content.ReadAsStringAsync();
        Assert.Contains("There is no page here", html, StringComparison.Ordinal);
        // The layout: the app's navigation and skip link around the page.
        Assert.Contains("<nav", html, StringComparison.Ordinal);
        Assert.Contains("Not found · CapReview", html, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/api/v1/proposals/99999")]
    [InlineData("/api/v1/cycles/99999")]
    [InlineData("/api/v1/packets/99999")]
    public async Task The_api_keeps_problem_details(string path)
    {
        var (client, _) = await factory.TokenClientAsync("not-found.admin@tarnby.example", RoleNames.Administrator);
        using (client)
        {
            client.DefaultRequestHeaders.Accept.Add(new MediaTypeWithQualityHeaderValue("text/html"));
            using HttpResponseMessage response = await client.GetAsync(path);
            Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
            Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        }
    }

    [Fact]
    public async Task A_program_fetching_a_download_keeps_problem_details()
    {
        var (client, _) = await factory.TokenClientAsync("not-found.board@tarnby.example", RoleNames.Reviewer);
        using (client)
        {
            using HttpResponseMessage response = await client.GetAsync("/proposals/99999/versions/1/xlsx");
            Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
            Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        }
    }

    /// <summary>A browser signed in with a role: cookies kept, and asking for HTML as a navigation does.</summary>
    private async Task<HttpClient> BrowserAsync(string role)
    {
        string email = $"not-found.{role.ToLowerInvariant()}.browser@tarnby.example";
        using (var scope = factory.Services.CreateScope())
        {
            var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
            if (await identity.FindByEmailAsync(email) is null)
            {
                await identity.CreateUserAsync(email, $"Not Found {role}", Password, [role]);
            }
        }
        HttpClient browser = FormSignIn.NewBrowser(factory);
        using HttpResponseMessage signedIn = await FormSignIn.PostAsync(browser, email, Password);
        Assert.True(signedIn.StatusCode is HttpStatusCode.Redirect or HttpStatusCode.Found, $"sign-in answered {signedIn.StatusCode}");
        browser.DefaultRequestHeaders.Accept.ParseAdd("text/html,application/xhtml+xml,application/xml;q=0.9,*/*;q=0.8");
        return browser;
    }
}
