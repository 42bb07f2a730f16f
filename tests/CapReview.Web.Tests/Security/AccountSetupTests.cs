using System.Net;
using System.Text.RegularExpressions;
using CapReview.TestSupport;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>
/// Setting up an account: two-step sign-in with an authenticator app (required where configured, codes usable once,
/// recovery codes once each, reset by an administrator for a lost phone), a first password changed at first sign-in,
/// and the rules for a new password.
/// </summary>
public sealed partial class AccountSetupTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Password = "violet-compass-2027";

    [Fact]
    public void The_tests_own_authenticator_gives_the_codes_of_RFC_6238_appendix_B()
    {
        // RFC 6238, Appendix B (SHA-1 rows), and RFC 4648 section 10 for base 32.
        byte[] secret = "12345678901234567890"u8.ToArray();
        Assert.Equal("94287082", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(59), 8));
        Assert.Equal("07081804", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(1111111109), 8));
        Assert.Equal("14050471", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(1111111111), 8));
        Assert.Equal("89005924", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(1234567890), 8));
        Assert.Equal("69279037", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(2000000000), 8));
        Assert.Equal("65353130", Rfc6238.Code(secret, DateTimeOffset.FromUnixTimeSeconds(20000000000), 8));
        Assert.Equal("foobar"u8.ToArray(), Rfc6238.FromBase32("MZXW6YTBOI======"));
    }

    [Fact]
    public async Task Where_two_step_sign_in_is_required_a_password_alone_reaches_only_the_account_page_until_an_app_is_set_up()
    {
        var clock = new SteppedClock(DateTimeOffset.UtcNow);
        using var app = TwoStepRequired(clock);
        await AccountDefenceTests.CreateUserAsync(app.Services, "two.step@tarnby.example", Password);
        using HttpClient browser = NewBrowser(app);
        using (var signedIn = await FormSignIn.PostAsync(browser, "two.step@tarnby.example", Password))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }

        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.Redirect, page.StatusCode);
            Assert.Equal("/account", page.Headers.Location!.OriginalString);
        }
        using (var api = await browser.GetAsync("/api/v1/proposals"))
        {
            Assert.Equal(HttpStatusCode.Forbidden, api.StatusCode);
        }
        using (var openApi = await browser.GetAsync("/openapi/v1.json"))
        {
            Assert.Equal(HttpStatusCode.Forbidden, openApi.StatusCode);
        }
        string account = await browser.GetStringAsync("/account");
        Assert.Contains("data-testid=\"two-step-required\"", account, StringComparison.Ordinal);
        Assert.Contains("<svg", account, StringComparison.Ordinal);
        byte[] secret = Rfc6238.FromBase32(Key().Match(account).Groups[1].Value);

        string wrong = Rfc6238.Code(secret, clock.GetUtcNow().AddMinutes(10));
        string refused = await PostFormAsync(browser, "/account", account, "enable-two-step", ("Enable.Code", wrong));
        Assert.Contains("That code is not the one the app shows now", refused, StringComparison.Ordinal);

        string enabled = await PostFormAsync(browser, "/account", refused, "enable-two-step", ("Enable.Code", Rfc6238.Code(secret, clock.GetUtcNow())));
        var recovery = RecoveryCode().Matches(enabled).Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(TwoStepSignIn.RecoveryCodeCount, recovery.Count);
        Assert.All(recovery, code => Assert.Matches("^[A-HJ-NP-Z2-9]{5}(-[A-HJ-NP-Z2-9]{5}){4}$", code));
        using (var scope = app.Services.CreateScope())
        {
            // Kept as SHA-256 hashes: the database holds none of the codes as shown.
            var identity = scope.ServiceProvider.GetRequiredService<CapReviewIdentityDbContext>();
            string stored = identity.UserTokens.Single(t => t.Name == "RecoveryCodes" && t.UserId == identity.Users.Single(u => u.Email == "two.step@tarnby.example").Id).Value!;
            Assert.All(recovery, code => Assert.DoesNotContain(code.Replace("-", "", StringComparison.Ordinal), stored.ToUpperInvariant(), StringComparison.Ordinal));
            Assert.All(recovery, code => Assert.Contains(HashedRecoveryCodeStore.Hash(code), stored, StringComparison.Ordinal));
        }
        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        }

        // The next sign-in asks for a code after the password; the code already used in this 30-second step is refused.
        using HttpClient again = NewBrowser(app);
        string second = await (await FormSignIn.PostAsync(again, "two.step@tarnby.example", Password)).Content.ReadAsStringAsync();
        Assert.Contains("Enter the six-digit code", second, StringComparison.Ordinal);
        string replayed = await PostFormAsync(again, "/signin", second, "signin-code", ("Second.Code", Rfc6238.Code(secret, clock.GetUtcNow())));
        Assert.Contains("That code is not right", replayed, StringComparison.Ordinal);
        clock.Advance(TimeSpan.FromSeconds(30));
        using (var signedIn = await FormSignIn.PostFormAsync(again, "/signin", replayed, "signin-code", ("Second.Code", Rfc6238.Code(secret, clock.GetUtcNow()))))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }
        using (var page = await again.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        }

        // A recovery code signs in once, typed in lower case without its hyphens if need be.
        using HttpClient lostPhone = NewBrowser(app);
        string asked = await (await FormSignIn.PostAsync(lostPhone, "two.step@tarnby.example", Password)).Content.ReadAsStringAsync();
        using (var recovered = await FormSignIn.PostFormAsync(lostPhone, "/signin", asked, "signin-code", ("Second.Code", recovery[0].Replace("-", "", StringComparison.Ordinal).ToLowerInvariant())))
        {
            Assert.Equal(HttpStatusCode.Redirect, recovered.StatusCode);
        }
        using HttpClient reuse = NewBrowser(app);
        string askedAgain = await (await FormSignIn.PostAsync(reuse, "two.step@tarnby.example", Password)).Content.ReadAsStringAsync();
        Assert.Contains("That code is not right", await PostFormAsync(reuse, "/signin", askedAgain, "signin-code", ("Second.Code", recovery[0])), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Each_recovery_code_works_once_after_others_were_used_typed_as_shown_or_in_lower_case_without_hyphens()
    {
        var clock = new SteppedClock(DateTimeOffset.UtcNow);
        using var app = TwoStepRequired(clock);
        await AccountDefenceTests.CreateUserAsync(app.Services, "many.codes@tarnby.example", Password);
        using HttpClient browser = NewBrowser(app);
        (await FormSignIn.PostAsync(browser, "many.codes@tarnby.example", Password)).Dispose();
        string account = await browser.GetStringAsync("/account");
        byte[] secret = Rfc6238.FromBase32(Key().Match(account).Groups[1].Value);
        string enabled = await PostFormAsync(browser, "/account", account, "enable-two-step", ("Enable.Code", Rfc6238.Code(secret, clock.GetUtcNow())));
        var recovery = RecoveryCode().Matches(enabled).Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(TwoStepSignIn.RecoveryCodeCount, recovery.Count);

        // Three codes one after another, in the three ways a person may type them; each sign-in succeeds.
        string[] typed = [recovery[0], recovery[1].Replace("-", "", StringComparison.Ordinal).ToLowerInvariant(), recovery[2].ToLowerInvariant()];
        foreach (string code in typed)
        {
            using HttpClient phoneLost = NewBrowser(app);
            string asked = await (await FormSignIn.PostAsync(phoneLost, "many.codes@tarnby.example", Password)).Content.ReadAsStringAsync();
            using var recovered = await FormSignIn.PostFormAsync(phoneLost, "/signin", asked, "signin-code", ("Second.Code", code));
            Assert.True(recovered.StatusCode == HttpStatusCode.Redirect, $"the recovery code typed as {code} was refused");
        }
        using (var scope = app.Services.CreateScope())
        {
            // Seven codes left, each still the SHA-256 of a code as shown (hashed once, not again at each redemption).
            var identity = scope.ServiceProvider.GetRequiredService<CapReviewIdentityDbContext>();
            string[] stored = identity.UserTokens.Single(t => t.Name == "RecoveryCodes" && t.UserId == identity.Users.Single(u => u.Email == "many.codes@tarnby.example").Id)
                .Value!.Split(';');
            Assert.Equal(recovery.Skip(3).Select(c => Sha256Hex(c.Replace("-", "", StringComparison.Ordinal))).Order(StringComparer.Ordinal), stored.Order(StringComparer.Ordinal));
        }

        // A code already used is refused, and the last one still works.
        using HttpClient reuse = NewBrowser(app);
        string again = await (await FormSignIn.PostAsync(reuse, "many.codes@tarnby.example", Password)).Content.ReadAsStringAsync();
        string refused = await PostFormAsync(reuse, "/signin", again, "signin-code", ("Second.Code", recovery[1]));
        Assert.Contains("That code is not right", refused, StringComparison.Ordinal);
        using var last = await FormSignIn.PostFormAsync(reuse, "/signin", refused, "signin-code", ("Second.Code", recovery[^1]));
        Assert.Equal(HttpStatusCode.Redirect, last.StatusCode);
    }

    /// <summary>Lower-case hex SHA-256 of the ASCII text, computed here rather than by the store under test.</summary>
    private static string Sha256Hex(string text) =>
        Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.ASCII.GetBytes(text)));

    [Fact]
    public async Task A_changed_password_needs_the_current_one_and_must_not_be_guessable()
    {
        await AccountDefenceTests.CreateUserAsync(factory.Services, "changes.password@tarnby.example", Password);
        using HttpClient browser = NewBrowser(factory);
        using (var signedIn = await FormSignIn.PostAsync(browser, "changes.password@tarnby.example", Password))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }
        string account = await browser.GetStringAsync("/account");
        // Masked fields that password managers fill: nothing stops pasting.
        Assert.Contains("type=\"password\"", account, StringComparison.Ordinal);
        Assert.Contains("autocomplete=\"new-password\"", account, StringComparison.Ordinal);
        Assert.Contains("autocomplete=\"current-password\"", await browser.GetStringAsync("/signin"), StringComparison.Ordinal);
        Assert.DoesNotContain("onpaste", account, StringComparison.OrdinalIgnoreCase);
        string shortOne = await PostFormAsync(browser, "/account", account, "change-password", ("Change.Current", Password), ("Change.New", "9-letters"));
        Assert.Contains("at least 10 characters", shortOne, StringComparison.Ordinal);
        account = shortOne;
        string wrongCurrent = await PostFormAsync(browser, "/account", account, "change-password", ("Change.Current", "not-my-password-2027"), ("Change.New", "copper-lantern-meadow"));
        Assert.Contains("The current password is not right.", wrongCurrent, StringComparison.Ordinal);
        string common = await PostFormAsync(browser, "/account", wrongCurrent, "change-password", ("Change.Current", Password), ("Change.New", "password1234"));
        Assert.Contains("too easy to guess", common, StringComparison.Ordinal);
        string organisation = await PostFormAsync(browser, "/account", common, "change-password", ("Change.Current", Password), ("Change.New", "TarnbyComponents1"));
        Assert.Contains("too easy to guess", organisation, StringComparison.Ordinal);
        // 64 characters and more are welcome, as typed (no truncation).
        string phrase = "the copper lantern hums beside a quiet meadow while barges drift by";
        string changed = await PostFormAsync(browser, "/account", organisation, "change-password", ("Change.Current", Password), ("Change.New", phrase));
        Assert.Contains("Your password is changed.", changed, StringComparison.Ordinal);

        using HttpClient later = NewBrowser(factory);
        using (var truncated = await FormSignIn.PostAsync(later, "changes.password@tarnby.example", phrase[..64]))
        {
            Assert.Equal(HttpStatusCode.OK, truncated.StatusCode);
        }
        using (var whole = await FormSignIn.PostAsync(later, "changes.password@tarnby.example", phrase))
        {
            Assert.Equal(HttpStatusCode.Redirect, whole.StatusCode);
        }
    }

    [Fact]
    public async Task A_first_password_from_an_administrator_opens_only_the_account_page_until_it_is_changed()
    {
        var admin = CapReview.Reviews.Access.Actor.Of("setup-admin", "Setup Admin", CapReview.Reviews.Access.Role.Administrator);
        await factory.Services.GetRequiredService<UserAdministration>().CreateAsync(admin, "first.password@tarnby.example", "First Password", Password, RoleNames.ProjectLead);
        using HttpClient browser = NewBrowser(factory);
        using (var signedIn = await FormSignIn.PostAsync(browser, "first.password@tarnby.example", Password))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }
        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.Redirect, page.StatusCode);
            Assert.Equal("/account", page.Headers.Location!.OriginalString);
        }
        string account = await browser.GetStringAsync("/account");
        Assert.Contains("data-testid=\"first-password\"", account, StringComparison.Ordinal);
        string changed = await PostFormAsync(browser, "/account", account, "change-password", ("Change.Current", Password), ("Change.New", "amber-ferry-lighthouse"));
        Assert.Contains("Your password is changed.", changed, StringComparison.Ordinal);
        Assert.DoesNotContain("data-testid=\"first-password\"", changed, StringComparison.Ordinal);
        using (var page = await browser.GetAsync("/proposals"))
        {
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        }
    }

    [Fact]
    public async Task An_administrator_resets_two_step_sign_in_for_a_lost_phone_and_the_old_key_stops_working()
    {
        var clock = new SteppedClock(DateTimeOffset.UtcNow);
        using var app = TwoStepRequired(clock);
        await AccountDefenceTests.CreateUserAsync(app.Services, "lost.phone@tarnby.example", Password);
        using HttpClient browser = NewBrowser(app);
        (await FormSignIn.PostAsync(browser, "lost.phone@tarnby.example", Password)).Dispose();
        string account = await browser.GetStringAsync("/account");
        byte[] oldKey = Rfc6238.FromBase32(Key().Match(account).Groups[1].Value);
        await PostFormAsync(browser, "/account", account, "enable-two-step", ("Enable.Code", Rfc6238.Code(oldKey, clock.GetUtcNow())));

        var admin = CapReview.Reviews.Access.Actor.Of("setup-admin", "Setup Admin", CapReview.Reviews.Access.Role.Administrator);
        var administration = app.Services.GetRequiredService<UserAdministration>();
        var person = (await administration.ListAsync(admin, CancellationToken.None)).Single(u => u.Email == "lost.phone@tarnby.example");
        Assert.True(person.TwoStep);
        await administration.ResetTwoStepAsync(admin, person.Id);
        Assert.False((await administration.ListAsync(admin, CancellationToken.None)).Single(u => u.Id == person.Id).TwoStep);

        // The next sign-in asks for no code but opens only the account page, with a new key to scan.
        clock.Advance(TimeSpan.FromSeconds(30));
        using HttpClient later = NewBrowser(app);
        using (var signedIn = await FormSignIn.PostAsync(later, "lost.phone@tarnby.example", Password))
        {
            Assert.Equal(HttpStatusCode.Redirect, signedIn.StatusCode);
        }
        string fresh = await later.GetStringAsync("/account");
        byte[] newKey = Rfc6238.FromBase32(Key().Match(fresh).Groups[1].Value);
        Assert.NotEqual(oldKey, newKey);
        string refused = await PostFormAsync(later, "/account", fresh, "enable-two-step", ("Enable.Code", Rfc6238.Code(oldKey, clock.GetUtcNow())));
        Assert.Contains("That code is not the one the app shows now", refused, StringComparison.Ordinal);
    }

    /// <summary>The app with two-step sign-in required, the test's clock, and sessions checked against the account on every request.</summary>
    private WebApplicationFactory<Program> TwoStepRequired(SteppedClock clock) => factory.WithWebHostBuilder(builder =>
    {
        builder.UseSetting("Security:RequireTwoFactor", "true");
        builder.UseSetting("Security:SessionCheckSeconds", "0");
        builder.ConfigureTestServices(services => services.AddSingleton<TimeProvider>(clock));
    });

    private static HttpClient NewBrowser(WebApplicationFactory<Program> app) => FormSignIn.NewBrowser(app);

    private static async Task<string> PostFormAsync(HttpClient client, string path, string page, string form, params (string Name, string Value)[] fields)
    {
        using var answer = await FormSignIn.PostFormAsync(client, path, page, form, fields);
        Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
        return await answer.Content.ReadAsStringAsync();
    }

    [GeneratedRegex("data-testid=\"authenticator-key\">([a-z2-7 ]+)<")]
    private static partial Regex Key();

    [GeneratedRegex("<li><code>([A-Za-z0-9-]+)</code></li>")]
    private static partial Regex RecoveryCode();
}
