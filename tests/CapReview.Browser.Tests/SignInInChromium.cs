using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

public sealed class SignInInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task A_page_that_needs_a_sign_in_sends_the_visitor_to_the_form_and_back()
    {
        await browser.App.UserAsync("petra.form@tarnby.example", "Petra Form", CapReview.Web.Identity.RoleNames.Reviewer);
        IPage page = await browser.Browser.NewPageAsync();
        await page.Context.ClearCookiesAsync();
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync();

        await page.Locator("#email").FillAsync("petra.form@tarnby.example");
        await page.Locator("#password").FillAsync("not-the-password-1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("signin-error")).ToHaveTextAsync("The email or the password is not right.");
        await BrowserFixture.ScreenshotAsync(page, "signin-error");

        await page.Locator("#password").FillAsync(AppHost.Password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Quick evaluation" })).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync("Petra Form");

        await page.GetByRole(AriaRole.Button, new() { Name = "Sign out" }).ClickAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "Sign in" })).ToBeVisibleAsync();
    }
}
