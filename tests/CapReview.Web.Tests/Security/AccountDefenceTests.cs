using System.Net;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>Lockout, the return address after sign-in, and the cookies production sets.</summary>
public sealed class AccountDefenceTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    [Fact]
    public async Task Eight_failed_sign_ins_lock_the_account_so_that_even_the_right_password_is_refused()
    {
        await CreateUserAsync(factory.Services, "locked.out@tarnby.example", "silver-meadow-2027");
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        for (int k = 0; k < 8; k++)
        {
            using var wrong = await FormSignIn.PostAsync(client, "locked.out@tarnby.example", "wrong-password-" + k);
            Assert.Equal(HttpStatusCode.OK, wrong.StatusCode);
            Assert.Contains(k < 7 ? "The email or the password is not right." : "the account is locked", await wrong.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        }
        using var right = await FormSignIn.PostAsync(client, "locked.out@tarnby.example", "silver-meadow-2027");
        Assert.Equal(HttpStatusCode.OK, right.StatusCode);
        Assert.Contains("the account is locked", await right.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.DoesNotContain(right.Headers.TryGetValues("Set-Cookie", out var cookies) ? cookies : [], c => c.StartsWith("capreview=", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("/cycles/3", true)]
    [InlineData("/", true)]
    [InlineData("/proposals/7?tab=risk", true)]
    [InlineData("//elsewhere.example/", false)]
    [InlineData("/\\elsewhere.example/", false)]
    [InlineData("\\\\elsewhere.example", false)]
    [InlineData("https://elsewhere.example/", false)]
    [InlineData("javascript:alert(1)", false)]
    [InlineData("/\tjavascript:alert(1)", false)]
    [InlineData("cycles/3", false)]
    [InlineData("", false)]
    [InlineData(null, false)]
    public void Only_a_path_of_the_app_is_a_return_address(string? address, bool local) =>
        // Common practice, no source: the rules of ASP.NET Core's own local-URL check, stricter about ':' and '\'.
        Assert.Equal(local, ReturnAddress.IsLocal(address));

    [Fact]
    public async Task A_sign_in_asked_to_return_to_another_site_goes_to_the_app_instead()
    {
        await CreateUserAsync(factory.Services, "return.address@tarnby.example", "return-tests-2027");
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        string form = await client.GetStringAsync("/signin?ReturnUrl=%5C%5Celsewhere.example");
        using var signedIn = await FormSignIn.PostFormAsync(client, "/signin?ReturnUrl=%5C%5Celsewhere.example", form, "signin",
            ("Input.Email", "return.address@tarnby.example"), ("Input.Password", "return-tests-2027"));
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        Assert.Equal("localhost", new Uri(new Uri("http://localhost/"), signedIn.Headers.Location!).Host);
    }

    [Fact]
    public async Task Production_cookies_are_host_only_https_only_strict_same_site_and_hidden_from_scripts()
    {
        using var production = factory.WithWebHostBuilder(builder => builder.UseEnvironment("Production"));
        await CreateUserAsync(production.Services, "cookies@tarnby.example", "cookie-tests-2027");
        using HttpClient client = production.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, BaseAddress = new Uri("https://localhost") });
        using var form = await client.GetAsync("/signin");
        string antiforgery = Assert.Single(form.Headers.GetValues("Set-Cookie"), c => c.StartsWith("__Host-capreview-form=", StringComparison.Ordinal));
        using var signedIn = await FormSignIn.PostAsync(client, "cookies@tarnby.example", "cookie-tests-2027");
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        string session = Assert.Single(signedIn.Headers.GetValues("Set-Cookie"), c => c.StartsWith("__Host-capreview=", StringComparison.Ordinal));
        foreach (string cookie in new[] { antiforgery, session })
        {
            string[] attributes = [.. cookie.Split(';').Skip(1).Select(a => a.Trim().ToLowerInvariant())];
            Assert.Contains("secure", attributes);
            Assert.Contains("httponly", attributes);
            Assert.Contains("path=/", attributes);
            Assert.DoesNotContain(attributes, a => a.StartsWith("domain=", StringComparison.Ordinal));
        }
        Assert.Contains("samesite=strict", session.ToLowerInvariant(), StringComparison.Ordinal);
        // The session cookie ends with the browser (no expires), and the server ends it after 8 hours (sliding).
        Assert.DoesNotContain("expires=", session.ToLowerInvariant(), StringComparison.Ordinal);
    }

    internal static async Task CreateUserAsync(IServiceProvider services, string email, string password, string role = RoleNames.ProjectLead)
    {
        using var scope = services.CreateScope();
        var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
        if (await identity.FindByEmailAsync(email) is null)
        {
            await identity.CreateUserAsync(email, email, password, [role]);
        }
    }
}
