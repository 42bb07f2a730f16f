using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>The app remembers, per user, the cycle last worked on, the ranking's filters and sort, and the portfolio's what-if.</summary>
public sealed class RememberedViewsInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task A_board_member_finds_their_cycle_filters_and_what_if_again_on_the_next_visit()
    {
        var (open, _) = await browser.DemoCyclesAsync();
        IPage page = await browser.SignedInPageAsync("aino.salo@tarnby.example", "Aino Salo", RoleNames.Reviewer, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + $"cycles/{open}/ranking");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await page.Locator("#filter-category").SelectOptionAsync("CostReduction");
        await page.GetByTestId("sort-cost").ClickAsync();
        await Assertions.Expect(page.Locator("th:has([data-testid=sort-cost])")).ToHaveAttributeAsync("aria-sort", "ascending");

        await page.GotoAsync(browser.App.BaseAddress + $"cycles/{open}/portfolio");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        // The page's own first solve done (the what-if unlocked), the what-if is typed and solved: the selection
        // within 900,000 on the page is the sign that it was solved, and so remembered.
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("within 1,500,000");
        await Assertions.Expect(page.GetByTestId("recalculate")).ToBeEnabledAsync();
        await page.Locator("#capital-limit").FillAsync("900000");
        await page.GetByTestId("recalculate").ClickAsync();
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("within 900,000");
        await Assertions.Expect(page.Locator("#capital-limit")).ToHaveValueAsync("900000");

        // The next visit: a new page, the cycles list first.
        await page.GotoAsync(browser.App.BaseAddress + "cycles");
        await Assertions.Expect(page.GetByTestId("last-cycle")).ToContainTextAsync("Capital plan 2027");
        await page.GetByTestId("last-cycle").GetByRole(AriaRole.Link, new() { Name = "ranking" }).ClickAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.Locator("#filter-category")).ToHaveValueAsync("CostReduction");
        await Assertions.Expect(page.Locator("th:has([data-testid=sort-cost])")).ToHaveAttributeAsync("aria-sort", "ascending");
        await page.GotoAsync(browser.App.BaseAddress + $"cycles/{open}/portfolio");
        await Assertions.Expect(page.Locator("#capital-limit")).ToHaveValueAsync("900000");
    }
}
