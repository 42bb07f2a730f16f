using System.Net;
using CapReview.Reviews.Access;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>
/// Browser sessions: ended by sign-out everywhere (a copied cookie stops working), after 30 idle minutes, 12 hours
/// after the sign-in however busy, and by an administrator (end sessions, disable the account).
/// </summary>
public sealed class SessionTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Password = "harbour-kestrel-2027";
    private static readonly Actor Admin = Actor.Of("session-admin", "Session Admin", Role.Administrator);

    [Fact]
    public async Task Signing_out_ends_the_session_so_that_a_copy_of_its_cookie_is_refused_and_the_browser_is_told_to_forget()
    {
        using var app = WithClock(new SteppedClock(DateTimeOffset.UtcNow));
        await AccountDefenceTests.CreateUserAsync(app.Services, "signs.out@tarnby.example", Password);
        using HttpClient browser = NewBrowser(app);
        using var signedIn = await FormSignIn.PostAsync(browser, "signs.out@tarnby.example", Password);
        string cookie = signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("capreview=", StringComparison.Ordinal)).Split(';')[0];
        Assert.Equal(HttpStatusCode.OK, await StatusWithCookieAsync(app, cookie, "/proposals"));
        string form = await browser.GetStringAsync("/proposals");
        using var signOut = await FormSignIn.PostFormAsync(browser, "/signout", form, null);
        Assert.Equal(HttpStatusCode.Redirect, signOut.StatusCode);
        Assert.Equal("\"cache\", \"storage\"", signOut.Headers.GetValues("Clear-Site-Data").Single());

        Assert.Equal(HttpStatusCode.Redirect, await StatusWithCookieAsync(app, cookie, "/proposals"));
    }

    /// <summary>
    /// Two app servers on one database, with the settings as shipped (no session-check interval changed): a cookie
    /// copied from a session is refused by both the moment the session is ended on one of them, whether by signing
    /// out, by an administrator's "end sessions" or by disabling the account.
    /// </summary>
    [Fact]
    public async Task A_copied_cookie_is_refused_on_every_server_as_soon_as_its_session_is_ended()
    {
        using var first = factory.WithWebHostBuilder(_ => { });
        using var second = factory.WithWebHostBuilder(_ => { });
        var administration = first.Services.GetRequiredService<UserAdministration>();

        string signedOut = await CopiedCookieAsync(first, "copied.signout@tarnby.example");
        Assert.Equal(HttpStatusCode.OK, await StatusWithCookieAsync(second, signedOut, "/proposals"));
        using (HttpClient browser = NewBrowser(first))
        {
            browser.DefaultRequestHeaders.Add("Cookie", signedOut);
            string form = await browser.GetStringAsync("/proposals");
            using var signOut = await FormSignIn.PostFormAsync(browser, "/signout", form, null);
            Assert.Equal(HttpStatusCode.Redirect, signOut.StatusCode);
        }
        Assert.Equal(HttpStatusCode.Redirect, await StatusWithCookieAsync(second, signedOut, "/proposals"));
        Assert.Equal(HttpStatusCode.Unauthorized, await StatusWithCookieAsync(second, signedOut, "/api/v1/proposals"));
        Assert.Equal(HttpStatusCode.Redirect, await StatusWithCookieAsync(first, signedOut, "/proposals"));

        string ended = await CopiedCookieAsync(first, "copied.ended@tarnby.example");
        Assert.Equal(HttpStatusCode.OK, await StatusWithCookieAsync(second, ended, "/proposals"));
        await administration.EndSessionsAsync(Admin, await UserIdAsync(first, "copied.ended@tarnby.example"));
        Assert.Equal(HttpStatusCode.Redirect, await StatusWithCookieAsync(second, ended, "/proposals"));

        string disabled = await CopiedCookieAsync(first, "copied.disabled@tarnby.example");
        Assert.Equal(HttpStatusCode.OK, await StatusWithCookieAsync(second, disabled, "/proposals"));
        await administration.SetDisabledAsync(Admin, await UserIdAsync(first, "copied.disabled@tarnby.example"), disabled: true);
        Assert.Equal(HttpStatusCode.Redirect, await StatusWithCookieAsync(second, disabled, "/proposals"));
    }

    /// <summary>Signs a new account in on <paramref name="app"/> through the form; the session cookie as a browser would send it.</summary>
    private static async Task<string> CopiedCookieAsync(WebApplicationFactory<Program> app, string email)
    {
        await AccountDefenceTests.CreateUserAsync(app.Services, email, Password);
        using HttpClient browser = NewBrowser(app);
        using var signedIn = await FormSignIn.PostAsync(browser, email, Password);
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        return signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("capreview=", StringComparison.Ordinal)).Split(';')[0];
    }

    [Fact]
    public async Task A_password_change_ends_the_accounts_other_sessions_and_keeps_the_one_it_was_made_in()
    {
        using var app = WithClock(new SteppedClock(DateTimeOffset.UtcNow));
        using HttpClient laptop = await SignedInAsync(app, "changes.everywhere@tarnby.example");
        using HttpClient phone = NewBrowser(app);
        Assert.Equal(HttpStatusCode.Redirect, (await FormSignIn.PostAsync(phone, "changes.everywhere@tarnby.example", Password)).StatusCode);
        string account = await laptop.GetStringAsync("/account");
        using var changed = await FormSignIn.PostFormAsync(laptop, "/account", account, "change-password",
            ("Change.Current", Password), ("Change.New", "saffron-tugboat-evening"));
        Assert.Contains("Your password is changed.", await changed.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(HttpStatusCode.OK, (await laptop.GetAsync("/proposals")).StatusCode);
        Assert.Equal(HttpStatusCode.Redirect, (await phone.GetAsync("/proposals")).StatusCode);
    }

    [Fact]
    public async Task A_session_ends_after_thirty_idle_minutes_and_twelve_hours_after_the_sign_in_however_busy()
    {
        var clock = new SteppedClock(DateTimeOffset.UtcNow);
        using var app = WithClock(clock);
        using HttpClient idle = await SignedInAsync(app, "idle@tarnby.example");
        clock.Advance(TimeSpan.FromMinutes(29));
        Assert.Equal(HttpStatusCode.OK, (await idle.GetAsync("/proposals")).StatusCode);
        clock.Advance(TimeSpan.FromMinutes(31));
        Assert.Equal(HttpStatusCode.Redirect, (await idle.GetAsync("/proposals")).StatusCode);

        using HttpClient busy = await SignedInAsync(app, "busy@tarnby.example");
        // A request every 20 minutes keeps the session alive (the cookie slides) until 12 hours after the sign-in.
        for (int k = 0; k < 35; k++)
        {
            clock.Advance(TimeSpan.FromMinutes(20));
            Assert.Equal(HttpStatusCode.OK, (await busy.GetAsync("/proposals")).StatusCode);
        }
        clock.Advance(TimeSpan.FromMinutes(21));
        Assert.Equal(HttpStatusCode.Redirect, (await busy.GetAsync("/proposals")).StatusCode);
    }

    [Fact]
    public async Task An_administrator_ends_a_persons_sessions_disables_the_account_or_resets_its_password_and_its_sessions_end_at_once()
    {
        using var app = WithClock(new SteppedClock(DateTimeOffset.UtcNow));
        var administration = app.Services.GetRequiredService<UserAdministration>();
        using HttpClient ended = await SignedInAsync(app, "ended@tarnby.example");
        await administration.EndSessionsAsync(Admin, await UserIdAsync(app, "ended@tarnby.example"));
        Assert.Equal(HttpStatusCode.Redirect, (await ended.GetAsync("/proposals")).StatusCode);
        using (HttpClient again = NewBrowser(app))
        {
            Assert.Equal(HttpStatusCode.Redirect, (await FormSignIn.PostAsync(again, "ended@tarnby.example", Password)).StatusCode);
        }

        using HttpClient disabled = await SignedInAsync(app, "disabled@tarnby.example");
        string id = await UserIdAsync(app, "disabled@tarnby.example");
        await administration.SetDisabledAsync(Admin, id, disabled: true);
        Assert.Equal(HttpStatusCode.Redirect, (await disabled.GetAsync("/proposals")).StatusCode);
        Assert.True((await administration.ListAsync(Admin, CancellationToken.None)).Single(u => u.Id == id).Disabled);
        using (HttpClient refused = NewBrowser(app))
        {
            using var answer = await FormSignIn.PostAsync(refused, "disabled@tarnby.example", Password);
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
            Assert.Contains("locked", await answer.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        }
        await administration.SetDisabledAsync(Admin, id, disabled: false);
        using (HttpClient back = NewBrowser(app))
        {
            Assert.Equal(HttpStatusCode.Redirect, (await FormSignIn.PostAsync(back, "disabled@tarnby.example", Password)).StatusCode);
        }
        // A forgotten password: a new random first password, to be replaced at the next sign-in; the old one stops working.
        string first = await administration.ResetPasswordAsync(Admin, id);
        Assert.Matches("^[a-km-np-z2-9]{20}$", first);
        using (HttpClient old = NewBrowser(app))
        {
            Assert.Equal(HttpStatusCode.OK, (await FormSignIn.PostAsync(old, "disabled@tarnby.example", Password)).StatusCode);
        }
        using (HttpClient reset = NewBrowser(app))
        {
            Assert.Equal(HttpStatusCode.Redirect, (await FormSignIn.PostAsync(reset, "disabled@tarnby.example", first)).StatusCode);
            using var page = await reset.GetAsync("/proposals");
            Assert.Equal("/account", page.Headers.Location!.OriginalString);
        }
        await Assert.ThrowsAsync<CapReview.Reviews.Common.RuleViolationException>(() =>
            administration.SetDisabledAsync(Actor.Of(id, "Self", Role.Administrator), id, disabled: true));
    }

    /// <summary>The app with the test's clock and the session checked against the account on every request.</summary>
    private WebApplicationFactory<Program> WithClock(SteppedClock clock) => factory.WithWebHostBuilder(builder =>
    {
        builder.UseSetting("Security:SessionCheckSeconds", "0");
        builder.ConfigureTestServices(services => services.AddSingleton<TimeProvider>(clock));
    });

    private static async Task<HttpClient> SignedInAsync(WebApplicationFactory<Program> app, string email)
    {
        await AccountDefenceTests.CreateUserAsync(app.Services, email, Password);
        HttpClient browser = NewBrowser(app);
        using var signedIn = await FormSignIn.PostAsync(browser, email, Password);
        Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await browser.GetAsync("/proposals")).StatusCode);
        return browser;
    }

    private static async Task<HttpStatusCode> StatusWithCookieAsync(WebApplicationFactory<Program> app, string cookie, string path)
    {
        using HttpClient copy = app.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = false });
        using var request = new HttpRequestMessage(HttpMethod.Get, path);
        request.Headers.Add("Cookie", cookie);
        using var answer = await copy.SendAsync(request);
        return answer.StatusCode;
    }

    private static async Task<string> UserIdAsync(WebApplicationFactory<Program> app, string email)
    {
        using var scope = app.Services.CreateScope();
        return (await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync(email))!.Id;
    }

    private static HttpClient NewBrowser(WebApplicationFactory<Program> app) => FormSignIn.NewBrowser(app);
}
