using System.Text.RegularExpressions;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

public sealed class QuickEvaluationInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private async Task<IPage> OpenAsync()
    {
        IPage page = await browser.SignedInPageAsync("lena.quick@tarnby.example", "Lena Quick", CapReview.Web.Identity.RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        return page;
    }

    [Fact]
    public async Task A_model_built_on_the_page_shows_its_chart_and_measures()
    {
        IPage page = await OpenAsync();
        await BrowserFixture.ScreenshotAsync(page, "quick-evaluation-example");

        // Start from nothing: remove the example's elements.
        ILocator rows = page.Locator("[data-testid=element-row]");
        for (int remaining = await rows.CountAsync(); remaining > 0; remaining--)
        {
            await page.GetByRole(AriaRole.Button, new() { Name = "Remove element 1" }).ClickAsync();
            await Assertions.Expect(rows).ToHaveCountAsync(remaining - 1);
        }
        await Assertions.Expect(page.Locator(".measures-invalid")).ToContainTextAsync("Add at least one cash-flow element");

        await page.Locator("#horizon").FillAsync("5");
        await page.Locator("#marr").FillAsync("10");

        await page.Locator("#new-element-type").SelectOptionAsync("Single");
        await page.GetByRole(AriaRole.Button, new() { Name = "Add element" }).ClickAsync();
        await page.Locator("#el-0-label").FillAsync("Press brake");
        await page.Locator("#el-0-amount").FillAsync("-1000");

        await page.Locator("#new-element-type").SelectOptionAsync("Uniform");
        await page.GetByRole(AriaRole.Button, new() { Name = "Add element" }).ClickAsync();
        await page.Locator("#el-1-label").FillAsync("Labour saved");
        await page.Locator("#el-1-category").SelectOptionAsync("Revenue");
        await page.Locator("#el-1-amount").FillAsync("300");

        // PW = −1000 + 300 (P/A, 10%, 5) = 137.24 (Microsoft.VisualBasic.Financial.PV gives 1137.24 for the series).
        await Assertions.Expect(page.GetByTestId("present-worth")).ToHaveTextAsync("137");
        await Assertions.Expect(page.GetByTestId("rate-of-return")).ToHaveTextAsync("15.24 %");
        await Assertions.Expect(page.Locator("#cash-flow-diagram-plot .main-svg").First).ToBeVisibleAsync();
        await Assertions.Expect(page.Locator("#cash-flow-diagram-plot g.point")).ToHaveCountAsync(6);
        await Assertions.Expect(page.Locator("#worth-profile-plot .main-svg").First).ToBeVisibleAsync();
        await BrowserFixture.ScreenshotAsync(page, "quick-evaluation-built");

        // A chart's hover label writes a payment with the same minus sign (U+2212) as the tables beside it.
        await page.Locator("#cash-flow-diagram-plot").ScrollIntoViewIfNeededAsync();
        var bar = await page.Locator("#cash-flow-diagram-plot g.point path").First.BoundingBoxAsync();
        await page.Mouse.MoveAsync(bar!.X + bar.Width / 2, bar.Y - 20);
        await page.Mouse.MoveAsync(bar.X + bar.Width / 2, bar.Y + bar.Height / 2, new() { Steps = 5 });
        await Assertions.Expect(page.Locator("#cash-flow-diagram-plot .hoverlayer .hovertext")).ToContainTextAsync("\u22121,000");
        Assert.DoesNotContain("-", await page.Locator("#cash-flow-diagram-plot .hoverlayer .hovertext").TextContentAsync() ?? "", StringComparison.Ordinal);
    }

    [Fact]
    public async Task Invalid_input_is_named_beside_its_field_and_never_breaks_the_page()
    {
        IPage page = await OpenAsync();
        await page.Locator("#el-1-last").FillAsync("40");
        await Assertions.Expect(page.Locator("#el-1-last-error")).ToContainTextAsync("after the horizon (12)");
        await Assertions.Expect(page.Locator("#el-1-last")).ToHaveAttributeAsync("aria-invalid", "true");

        await page.Locator("#marr").FillAsync("ten");
        await Assertions.Expect(page.Locator("#marr-error")).ToContainTextAsync("is not a number");
        await Assertions.Expect(page.Locator(".measures-invalid")).ToContainTextAsync("2 fields need attention");

        await page.Locator("#marr").FillAsync("9");
        await page.Locator("#el-1-last").FillAsync("12");
        await Assertions.Expect(page.GetByTestId("present-worth")).ToHaveTextAsync(new Regex(@"^\d"));
        await BrowserFixture.ScreenshotAsync(page, "quick-evaluation-recovered");
    }
}
