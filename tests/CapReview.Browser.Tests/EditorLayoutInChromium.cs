using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// The proposal editor by the boxes Chromium lays out: at 1280 px nothing covers an element's label and no figure
/// table of the risk panel is cut off; on a 390 px phone a table wider than the screen is a labelled region that
/// scrolls and shows that it does.
/// </summary>
public sealed class EditorLayoutInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private async Task<IPage> SolarAsync(int width, int height)
    {
        int solarId;
        using (var scope = browser.App.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
            var oskar = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("oskar.lind@tarnby.example");
            var own = await scope.ServiceProvider.GetRequiredService<ProposalService>().ListOwnAsync(Actor.Of(oskar!.Id, "Oskar Lind", Role.ProjectLead), CancellationToken.None);
            solarId = own.Single(p => p.Title == "Rooftop solar array, dispatch hall").Id;
        }
        IPage page = await browser.SignedInPageAsync("oskar.lind@tarnby.example", "Oskar Lind", RoleNames.ProjectLead, DemoScenario.Password);
        await page.SetViewportSizeAsync(width, height);
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{solarId}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        // The solar array's three parameters: the tornado, spider and scenarios appear once the domain has computed them.
        await Assertions.Expect(page.GetByTestId("tornado-table").Locator("tbody tr")).ToHaveCountAsync(3);
        return page;
    }

    [Fact]
    public async Task At_1280_px_every_label_field_is_whole_and_no_risk_table_is_cut_off()
    {
        IPage page = await SolarAsync(1280, 900);
        await BrowserFixture.ScreenshotAsync(page, "editor-1280");
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=elements-heading]"), "editor-elements-1280");
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=risk-heading]"), "editor-risk-1280");
        int rows = await page.GetByTestId("element-row").CountAsync();
        for (int e = 0; e < rows; e++)
        {
            var label = (await page.Locator($"#el-{e}-label").BoundingBoxAsync())!;
            var category = (await page.Locator($"#el-{e}-category").BoundingBoxAsync())!;
            var cell = (await page.Locator($"#el-{e}-label").Locator("xpath=..").BoundingBoxAsync())!;
            // The label's box ends before the category's begins, and inside its own cell.
            Assert.True(label.X + label.Width <= category.X, $"Element {e + 1}: the label field ends at {label.X + label.Width}, the category begins at {category.X}.");
            Assert.True(label.X + label.Width <= cell.X + cell.Width + 0.5, $"Element {e + 1}: the label field overflows its cell.");
            Assert.True(label.Width >= 140, $"Element {e + 1}: the label field is only {label.Width} px wide.");
        }
        foreach (string table in new[] { "tornado-table", "spider-table", "scenarios-table" })
        {
            // Not cut off: the table fits the frame it scrolls in, so every column shows without scrolling.
            int[] sizes = await page.GetByTestId(table).EvaluateAsync<int[]>("t => [t.parentElement.scrollWidth, t.parentElement.clientWidth]");
            var (scroll, client) = (sizes[0], sizes[1]);
            Assert.True(scroll <= client, $"The {table} is {scroll} px wide in a frame of {client} px.");
        }
    }

    [Fact]
    public async Task On_a_phone_a_wide_table_is_a_labelled_region_that_shows_it_scrolls()
    {
        IPage page = await SolarAsync(390, 844);
        await BrowserFixture.ScreenshotAsync(page, "editor-390");
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=elements-heading]"), "editor-elements-390");
        foreach (string table in new[] { "table.element-grid", "[data-testid=risk-parameters]", "[data-testid=spider-table]" })
        {
            var frame = page.Locator(table).Locator("xpath=..");
            await Assertions.Expect(frame).ToHaveAttributeAsync("role", "region");
            await Assertions.Expect(frame).ToHaveAttributeAsync("aria-label", new System.Text.RegularExpressions.Regex("scrolls sideways"));
            bool scrolls = await frame.EvaluateAsync<bool>("f => f.scrollWidth > f.clientWidth");
            Assert.True(scrolls, $"{table} fits a phone: this check needs a table wider than the screen.");
            // The frame's edge shadows, which show while there is more to scroll to.
            string background = await frame.EvaluateAsync<string>("f => getComputedStyle(f).backgroundImage");
            Assert.Contains("gradient", background, StringComparison.Ordinal);
        }
        // The page itself never scrolls sideways.
        Assert.True(await page.EvaluateAsync<bool>("() => document.documentElement.scrollWidth <= window.innerWidth"));
    }
}
