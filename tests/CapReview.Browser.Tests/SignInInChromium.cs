using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

public sealed class SignInInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task A_page_that_needs_a_sign_in_sends_the_visitor_to_the_form_and_back()
    {
        await browser.App.UserAsync("petra.form@tarnby.example", "Petra Form", CapReview.Web.Identity.RoleNames.Reviewer);
        IPage page = await browser.NewVisitorPageAsync();
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync();

        await page.Locator("#email").FillAsync("petra.form@tarnby.example");
        await page.Locator("#password").FillAsync("not-the-password-1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("signin-error")).ToHaveTextAsync("The email or the password is not right, or the account is locked (for 10 minutes after 8 failed attempts, or by an administrator).");
        await BrowserFixture.ScreenshotAsync(page, "signin-error");

        await page.Locator("#password").FillAsync(AppHost.Password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Quick evaluation" })).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync("Petra Form");

        await page.GetByRole(AriaRole.Button, new() { Name = "Sign out" }).ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync();
    }

    [Fact]
    public async Task Two_step_sign_in_is_set_up_on_the_account_page_and_asked_for_after_the_password()
    {
        await browser.App.UserAsync("tomas.steps@tarnby.example", "Tomas Steps", CapReview.Web.Identity.RoleNames.ProjectLead);
        IPage page = await browser.SignedInPageAsync("tomas.steps@tarnby.example", "Tomas Steps", CapReview.Web.Identity.RoleNames.ProjectLead);
        await page.GetByTestId("signed-in-as").ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Your account" })).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Img, new() { Name = "QR code of the authenticator key" })).ToBeVisibleAsync();
        string key = await page.GetByTestId("authenticator-key").InnerTextAsync();
        await page.Locator("#enable-code").FillAsync(CapReview.TestSupport.Rfc6238.Code(CapReview.TestSupport.Rfc6238.FromBase32(key), DateTimeOffset.UtcNow));
        await page.GetByRole(AriaRole.Button, new() { Name = "Turn on two-step sign-in" }).ClickAsync();
        var codes = page.GetByTestId("recovery-codes").Locator("code");
        await Assertions.Expect(codes).ToHaveCountAsync(10);
        string recovery = await codes.First.InnerTextAsync();
        await BrowserFixture.ScreenshotAsync(page, "two-step-on");

        await page.GetByRole(AriaRole.Button, new() { Name = "Sign out" }).ClickAsync();
        await page.Locator("#email").FillAsync("tomas.steps@tarnby.example");
        await page.Locator("#password").FillAsync(AppHost.Password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByText("Enter the six-digit code your authenticator app shows")).ToBeVisibleAsync();
        await BrowserFixture.ScreenshotAsync(page, "two-step-code");
        // The code just used to turn it on is spent; a recovery code signs in (once).
        await page.Locator("#code").FillAsync(recovery);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync("Tomas Steps");
    }

    [Fact]
    public async Task An_open_page_turns_to_the_sign_in_when_its_session_is_ended_elsewhere()
    {
        IPage page = await browser.SignedInPageAsync("ended.elsewhere@tarnby.example", "Ended Elsewhere", CapReview.Web.Identity.RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Quick evaluation" })).ToBeVisibleAsync();

        using (var scope = browser.App.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReview.Web.Identity.CapReviewUser>>();
            var user = await users.FindByEmailAsync("ended.elsewhere@tarnby.example");
            await browser.App.Services.GetRequiredService<CapReview.Web.Identity.UserAdministration>()
                .EndSessionsAsync(CapReview.Reviews.Access.Actor.Of("browser-admin", "Browser Admin", CapReview.Reviews.Access.Role.Administrator), user!.Id);
        }
        // Without a reload: the page's circuit checks its session and sends it to the sign-in.
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync(new() { Timeout = 15_000 });
    }

    [Fact]
    public async Task A_page_whose_session_ends_before_it_turns_interactive_goes_to_the_sign_in()
    {
        const string email = "ended.early@tarnby.example";
        IPage page = await browser.SignedInPageAsync(email, "Ended Early", CapReview.Web.Identity.RoleNames.ProjectLead);
        // The page is drawn with the session still standing; its live connection is held until the session has ended.
        var asked = new TaskCompletionSource();
        var release = new TaskCompletionSource();
        await page.RouteAsync("**/_blazor/negotiate**", async route =>
        {
            asked.TrySetResult();
            await release.Task;
            await route.ContinueAsync();
        });
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Quick evaluation" })).ToBeVisibleAsync();
        await asked.Task.WaitAsync(TimeSpan.FromSeconds(30));

        using (var scope = browser.App.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<Microsoft.AspNetCore.Identity.UserManager<CapReview.Web.Identity.CapReviewUser>>();
            var user = await users.FindByEmailAsync(email);
            await browser.App.Services.GetRequiredService<CapReview.Web.Identity.UserAdministration>()
                .EndSessionsAsync(CapReview.Reviews.Access.Actor.Of("browser-admin", "Browser Admin", CapReview.Reviews.Access.Role.Administrator), user!.Id);
        }
        release.SetResult();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync(new() { Timeout = 15_000 });
        Assert.Empty(browser.App.Log.Errors());
    }
}
