using System.Net;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>Lockout, the return address after sign-in, and the cookies production sets.</summary>
public sealed partial class AccountDefenceTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    /// <summary>The one answer to every refused password sign-in, whatever the reason.</summary>
    private const string Refusal = "The email or the password is not right, or the account is locked (for 10 minutes after 8 failed attempts, or by an administrator).";

    [Fact]
    public async Task Eight_failed_sign_ins_lock_the_account_so_that_even_the_right_password_is_refused()
    {
        await CreateUserAsync(factory.Services, "locked.out@tarnby.example", "silver-meadow-2027");
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        for (int k = 0; k < 8; k++)
        {
            using var wrong = await FormSignIn.PostAsync(client, "locked.out@tarnby.example", "wrong-password-" + k);
            Assert.Equal(HttpStatusCode.OK, wrong.StatusCode);
            Assert.Equal(Refusal, ErrorOf(await wrong.Content.ReadAsStringAsync()));
        }
        using var right = await FormSignIn.PostAsync(client, "locked.out@tarnby.example", "silver-meadow-2027");
        Assert.Equal(HttpStatusCode.OK, right.StatusCode);
        Assert.Equal(Refusal, ErrorOf(await right.Content.ReadAsStringAsync()));
        Assert.DoesNotContain(right.Headers.TryGetValues("Set-Cookie", out var cookies) ? cookies : [], c => c.StartsWith("capreview=", StringComparison.Ordinal));
        using (var scope = factory.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReviewUser>>();
            Assert.True(await users.IsLockedOutAsync((await users.FindByEmailAsync("locked.out@tarnby.example"))!));
        }
    }

    /// <summary>
    /// Whether an account exists, is locked (by failures or by an administrator) or was given a wrong password, the
    /// form answers in the same words, so that the answer tells nothing about the account.
    /// </summary>
    [Fact]
    public async Task Sign_in_gives_the_same_answer_whether_the_account_exists_is_locked_or_the_password_is_wrong()
    {
        await CreateUserAsync(factory.Services, "same.answer@tarnby.example", "quartz-lagoon-2027");
        await CreateUserAsync(factory.Services, "same.locked@tarnby.example", "quartz-lagoon-2027");
        await CreateUserAsync(factory.Services, "same.disabled@tarnby.example", "quartz-lagoon-2027");
        using HttpClient client = factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        var answers = new Dictionary<string, string?>();
        async Task<string?> AnswerAsync(string email, string password)
        {
            using var answer = await FormSignIn.PostAsync(client, email, password);
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
            return ErrorOf(await answer.Content.ReadAsStringAsync());
        }
        answers["no such account"] = await AnswerAsync("nobody.at.all@tarnby.example", "quartz-lagoon-2027");
        answers["wrong password"] = await AnswerAsync("same.answer@tarnby.example", "quartz-lagoon-2026");
        for (int k = 0; k < 8; k++)
        {
            await AnswerAsync("same.locked@tarnby.example", "wrong-" + k);
            // The same number of failures for an address no account has.
            answers[$"no such account, attempt {k + 2}"] = await AnswerAsync("nobody.at.all@tarnby.example", "wrong-" + k);
        }
        answers["locked, right password"] = await AnswerAsync("same.locked@tarnby.example", "quartz-lagoon-2027");
        answers["locked, wrong password"] = await AnswerAsync("same.locked@tarnby.example", "quartz-lagoon-2026");
        var admin = CapReview.Reviews.Access.Actor.Of("defence-admin", "Defence Admin", CapReview.Reviews.Access.Role.Administrator);
        var administration = factory.Services.GetRequiredService<UserAdministration>();
        string disabledId = (await administration.ListAsync(admin, CancellationToken.None)).Single(u => u.Email == "same.disabled@tarnby.example").Id;
        await administration.SetDisabledAsync(admin, disabledId, disabled: true);
        answers["disabled, right password"] = await AnswerAsync("same.disabled@tarnby.example", "quartz-lagoon-2027");
        Assert.All(answers, answer => Assert.True(answer.Value == Refusal, $"{answer.Key}: {answer.Value}"));
    }

    /// <summary>
    /// The time a refusal takes is the time of one password-hash check (PBKDF2, 100,000 iterations), whether the
    /// account exists or not and whether it is locked: each refusal verifies the password against one hash of the
    /// same strength as a real account's. (Timing itself is not measured: a test of the work done is steady.)
    /// </summary>
    [Fact]
    public async Task Every_refused_sign_in_checks_the_password_against_one_hash_as_strong_as_an_accounts()
    {
        var hasher = new CountingPasswordHasher(Microsoft.Extensions.Options.Options.Create(new Microsoft.AspNetCore.Identity.PasswordHasherOptions()));
        using var app = factory.WithWebHostBuilder(builder => builder.ConfigureTestServices(services =>
            services.AddScoped<Microsoft.AspNetCore.Identity.IPasswordHasher<CapReviewUser>>(_ => hasher)));
        await CreateUserAsync(app.Services, "same.work@tarnby.example", "cobalt-harbour-2027");
        await CreateUserAsync(app.Services, "same.work.locked@tarnby.example", "cobalt-harbour-2027");
        byte[] real;
        using (var scope = app.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReviewUser>>();
            var locked = (await users.FindByEmailAsync("same.work.locked@tarnby.example"))!;
            await users.SetLockoutEndDateAsync(locked, DateTimeOffset.UtcNow.AddMinutes(10));
            real = Convert.FromBase64String((await users.FindByEmailAsync("same.work@tarnby.example"))!.PasswordHash!);
        }
        using HttpClient client = app.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        foreach (var (email, password) in new[]
        {
            ("nobody.works@tarnby.example", "cobalt-harbour-2027"),
            ("same.work@tarnby.example", "cobalt-harbour-2026"),
            ("same.work.locked@tarnby.example", "cobalt-harbour-2027"),
        })
        {
            hasher.Verified.Clear();
            using var answer = await FormSignIn.PostAsync(client, email, password);
            Assert.Equal(Refusal, ErrorOf(await answer.Content.ReadAsStringAsync()));
            string checkedAgainst = Assert.Single(hasher.Verified);
            // Identity's version-3 layout: format, PRF, iterations and salt length (13 bytes) say how much work a check is.
            byte[] used = Convert.FromBase64String(checkedAgainst);
            Assert.True(real.AsSpan(0, 13).SequenceEqual(used.AsSpan(0, 13)), $"{email}: checked against a hash of another strength");
            Assert.Equal(real.Length, used.Length);
        }
    }

    private static string? ErrorOf(string page) => SignInError().Match(page) is { Success: true } match ? System.Net.WebUtility.HtmlDecode(match.Groups[1].Value) : null;

    [System.Text.RegularExpressions.GeneratedRegex("data-testid=\"signin-error\">([^<]*)<")]
    private static partial System.Text.RegularExpressions.Regex SignInError();

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

    /// <summary>
    /// A return address with letters beyond ASCII (as a browser sends them, percent-encoded UTF-8) signs in to that
    /// address, encoded the same way, never to an error: the form shows and the sign-in redirects. On Kestrel, as in
    /// production: the test server would let a header through that Kestrel refuses to send.
    /// </summary>
    [Theory]
    [InlineData("/cycles/%C3%BCbersicht")]
    [InlineData("/proposals/7?tab=%E2%82%AC")]
    [InlineData("/%F0%9F%93%88/%E6%B8%AC%E8%A9%A6")]
    [InlineData("/caf%C3%A9%20cr%C3%A8me")]
    public async Task A_return_address_beyond_ascii_is_followed_encoded_and_never_gives_an_error(string address)
    {
        using var kestrel = factory.WithWebHostBuilder(_ => { });
        kestrel.UseKestrel(0);
        kestrel.StartServer();
        await CreateUserAsync(kestrel.Services, "unicode.return@tarnby.example", "tangerine-viaduct-2027");
        string listening = kestrel.Services.GetRequiredService<Microsoft.AspNetCore.Hosting.Server.IServer>()
            .Features.Get<Microsoft.AspNetCore.Hosting.Server.Features.IServerAddressesFeature>()!.Addresses.First();
        // A client of our own: the factory's clients follow redirects once the app runs on Kestrel.
        using var handler = new SocketsHttpHandler { AllowAutoRedirect = false, UseCookies = true, CookieContainer = new System.Net.CookieContainer() };
        using var client = new HttpClient(handler) { BaseAddress = new Uri(listening) };
        string path = "/signin?ReturnUrl=" + Uri.EscapeDataString(Uri.UnescapeDataString(address));
        using var page = await client.GetAsync(path);
        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        using var signedIn = await FormSignIn.PostFormAsync(client, path, await page.Content.ReadAsStringAsync(), "signin",
            ("Input.Email", "unicode.return@tarnby.example"), ("Input.Password", "tangerine-viaduct-2027"));
        Assert.True(signedIn.StatusCode == HttpStatusCode.Redirect && signedIn.Headers.Location is not null,
            $"the sign-in answered {(int)signedIn.StatusCode} without a place to go: {signedIn.Headers}");
        var target = new Uri(client.BaseAddress!, signedIn.Headers.Location!);
        Assert.Equal(client.BaseAddress!.Authority, target.Authority);
        Assert.Equal(address, target.PathAndQuery);
    }

    /// <summary>
    /// Between the password and the code, Identity keeps the person in a cookie of its own; in production it follows
    /// the same rules as the session cookie: __Host- prefix, Secure, HttpOnly, SameSite=Strict, path /, no domain.
    /// </summary>
    [Fact]
    public async Task The_two_step_cookie_between_password_and_code_follows_the_production_cookie_rules()
    {
        using var production = factory.WithWebHostBuilder(builder => builder.UseEnvironment("Production"));
        await CreateUserAsync(production.Services, "two.step.cookie@tarnby.example", "cookie-steps-2027");
        string key;
        using (var scope = production.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReviewUser>>();
            var user = (await users.FindByEmailAsync("two.step.cookie@tarnby.example"))!;
            await users.ResetAuthenticatorKeyAsync(user);
            await users.SetTwoFactorEnabledAsync(user, true);
            key = (await users.GetAuthenticatorKeyAsync(user))!;
        }
        using HttpClient client = production.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, BaseAddress = new Uri("https://localhost") });
        using var password = await FormSignIn.PostAsync(client, "two.step.cookie@tarnby.example", "cookie-steps-2027");
        string asked = await password.Content.ReadAsStringAsync();
        Assert.Contains("Enter the six-digit code", asked, StringComparison.Ordinal);
        var cookies = password.Headers.GetValues("Set-Cookie").ToList();
        Assert.NotEmpty(cookies);
        Assert.All(cookies, cookie =>
        {
            Assert.StartsWith("__Host-", cookie, StringComparison.Ordinal);
            string[] attributes = [.. cookie.Split(';').Skip(1).Select(a => a.Trim().ToLowerInvariant())];
            Assert.Contains("secure", attributes);
            Assert.Contains("httponly", attributes);
            Assert.Contains("samesite=strict", attributes);
            Assert.Contains("path=/", attributes);
            Assert.DoesNotContain(attributes, a => a.StartsWith("domain=", StringComparison.Ordinal));
        });

        // The cookie carries the person to the second step: the code signs in.
        string code = CapReview.TestSupport.Rfc6238.Code(CapReview.TestSupport.Rfc6238.FromBase32(key), DateTimeOffset.UtcNow);
        using var signedIn = await FormSignIn.PostFormAsync(client, "/signin", asked, "signin-code", ("Second.Code", code));
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        Assert.Contains(signedIn.Headers.GetValues("Set-Cookie"), c => c.StartsWith("__Host-capreview=", StringComparison.Ordinal));
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
