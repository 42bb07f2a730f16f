using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>The main tasks with the keyboard alone: Tab to a control, Enter or Space to use it, and the focus always visible.</summary>
public sealed class KeyboardInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    /// <summary>Presses Tab until the focused element matches the CSS selector (or, written text=…, has that text), as a keyboard user would; fails if it is never reached.</summary>
    private static async Task TabToAsync(IPage page, string selector, int limit = 250)
    {
        for (int k = 0; k < limit; k++)
        {
            await page.Keyboard.PressAsync("Tab");
            if (await page.EvaluateAsync<bool>("s => { const e = document.activeElement; return !!e && (s.startsWith('text=') ? e.textContent.trim() === s.slice(5) : e.matches(s)); }", selector))
            {
                string outline = await page.EvaluateAsync<string>("() => getComputedStyle(document.activeElement).outlineStyle");
                Assert.NotEqual("none", outline);
                return;
            }
        }
        Assert.Fail($"{selector} is not reachable with Tab.");
    }

    [Fact]
    public async Task A_lead_builds_a_model_and_a_board_member_sorts_the_ranking_without_a_mouse()
    {
        var (open, _) = await browser.DemoCyclesAsync();
        IPage page = await browser.SignedInPageAsync("keyboard.lead@example.test", "Kim Keys", RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        int rows = await page.GetByTestId("element-row").CountAsync();
        await TabToAsync(page, "text=Add element");
        await page.Keyboard.PressAsync("Enter");
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(rows + 1);
        await TabToAsync(page, $"button[aria-label='Remove element {rows + 1}']");
        await page.Keyboard.PressAsync("Space");
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(rows);

        IPage board = await browser.SignedInPageAsync("tove.berg@tarnby.example", "Tove Berg", RoleNames.Reviewer, DemoScenario.Password);
        await board.GotoAsync(browser.App.BaseAddress + $"cycles/{open}/ranking");
        await board.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await TabToAsync(board, "[data-testid=sort-proposal]");
        await board.Keyboard.PressAsync("Enter");
        await Assertions.Expect(board.Locator("th:has([data-testid=sort-proposal])")).ToHaveAttributeAsync("aria-sort", "ascending");
        await board.Keyboard.PressAsync("Enter");
        await Assertions.Expect(board.Locator("th:has([data-testid=sort-proposal])")).ToHaveAttributeAsync("aria-sort", "descending");
    }
}
