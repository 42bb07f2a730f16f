using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// Issue 17 in Chromium: the after-tax switch of the ranking and portfolio by mouse and keyboard, the swap answer
/// following the MARR what-if, the app's own not-found page for missing ids, and a revision pending beside the version
/// the board reviews.
/// </summary>
public sealed class WhatIfControlsInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private const string Board = "tove.berg@tarnby.example";

    private async Task<int> DemoCycleAsync()
    {
        using var scope = browser.App.Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
        return (await scope.ServiceProvider.GetRequiredService<CycleService>().ListAsync(CancellationToken.None)).Single(c => c.Name == "Capital plan 2027").Id;
    }

    private async Task<IPage> BoardPageAsync(string path)
    {
        IPage page = await browser.SignedInPageAsync(Board, "Tove Berg", RoleNames.Reviewer, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + path);
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        return page;
    }

    [Fact]
    public async Task The_rankings_after_tax_switch_turns_by_click_space_and_enter_and_the_swap_follows_the_what_if()
    {
        int cycle = await DemoCycleAsync();
        IPage page = await BoardPageAsync($"cycles/{cycle}/ranking");
        ILocator taxSwitch = page.GetByRole(AriaRole.Switch, new() { Name = "Figures: after tax" });
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "false");

        await taxSwitch.ClickAsync();
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "true");
        await Assertions.Expect(page.GetByTestId("tax-caution")).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("ranking-basis")).ToContainTextAsync("after-tax");

        await taxSwitch.FocusAsync();
        await page.Keyboard.PressAsync("Space");
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "false");
        await Assertions.Expect(page.GetByTestId("tax-caution")).ToHaveCountAsync(0);
        await page.Keyboard.PressAsync("Enter");
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "true");
        await Assertions.Expect(page.GetByTestId("tax-caution")).ToBeVisibleAsync();
        await taxSwitch.ClickAsync();
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "false");

        // The swap answer reads the ranking's what-if: the cycle's MARR first, then every MARR raised by 2 points.
        await Assertions.Expect(page.GetByTestId("swap-result")).ToContainTextAsync("At the cycle's MARR");
        await page.Locator("#marr-shift").SelectOptionAsync("2");
        await Assertions.Expect(page.GetByTestId("ranking-basis")).ToContainTextAsync("raised by 2 points");
        await Assertions.Expect(page.GetByTestId("swap-result")).ToContainTextAsync("With every MARR raised by 2.0 points");
        // The lists show the two proposals the answer is about, though the what-if reordered the ranking under them.
        string chosenFirst = await page.Locator("#swap-first").InputValueAsync();
        string chosenSecond = await page.Locator("#swap-second").InputValueAsync();
        await Assertions.Expect(page.GetByTestId("swap-result")).ToContainTextAsync($"{chosenFirst} and {chosenSecond} ");
        await BrowserFixture.ScreenshotAsync(page, "ranking-tax-switch");
    }

    [Fact]
    public async Task The_portfolios_after_tax_switch_turns_by_click_space_and_enter()
    {
        int cycle = await DemoCycleAsync();
        IPage page = await BoardPageAsync($"cycles/{cycle}/portfolio");
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("Proven optimal.");
        ILocator taxSwitch = page.GetByRole(AriaRole.Switch, new() { Name = "Figures: after tax" });
        await Assertions.Expect(taxSwitch).ToBeEnabledAsync();
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "false");

        await taxSwitch.ClickAsync();
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "true");
        await taxSwitch.FocusAsync();
        await page.Keyboard.PressAsync("Space");
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "false");
        await page.Keyboard.PressAsync("Enter");
        await Assertions.Expect(taxSwitch).ToHaveAttributeAsync("aria-checked", "true");

        await page.GetByTestId("recalculate").ClickAsync();
        await Assertions.Expect(page.GetByTestId("tax-caution")).ToBeVisibleAsync();
    }

    [Theory]
    [InlineData("cycles/abc")]
    [InlineData("cycles/99999")]
    [InlineData("proposals/99999")]
    [InlineData("packets/xyz")]
    [InlineData("packets/99999")]
    public async Task A_missing_or_malformed_id_shows_the_apps_not_found_page(string path)
    {
        await DemoCycleAsync();
        IPage page = await browser.SignedInPageAsync(Board, "Tove Berg", RoleNames.Reviewer, DemoScenario.Password);
        IResponse? response = await page.GotoAsync(browser.App.BaseAddress + path);
        Assert.Equal(404, response!.Status);
        await Assertions.Expect(page.GetByRole(AriaRole.Heading, new() { Name = "There is no page here" })).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByRole(AriaRole.Navigation, new() { Name = "Main" })).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync("Tove Berg");
    }

    [Fact]
    public async Task The_board_sees_a_revision_pending_and_the_lead_resubmits_it()
    {
        int cycle = await DemoCycleAsync();
        int proposalId;
        using (var scope = browser.App.Services.CreateScope())
        {
            var maren = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("maren.holt@tarnby.example");
            var owner = Actor.Of(maren!.Id, "Maren Holt", Role.ProjectLead);
            var proposals = scope.ServiceProvider.GetRequiredService<ProposalService>();
            ProposalView paint = (await proposals.ListOwnAsync(owner, CancellationToken.None)).Single(p => p.Title == "Paint shop extraction with carbon filters");
            proposalId = paint.Id;
            var model = paint.Latest.Assumptions.Model;
            var first = model.Elements![0]!;
            var changed = paint.Latest.Assumptions with { Model = model with { Elements = [first with { Amount = first.Amount - 5_000 }, .. model.Elements.Skip(1)] } };
            await proposals.ReviseAsync(owner, paint.Id, paint.Revision, changed, "Filter housing quote came in higher", CancellationToken.None);
        }

        IPage board = await BoardPageAsync($"cycles/{cycle}");
        await Assertions.Expect(board.GetByTestId("revision-pending")).ToContainTextAsync("Revision pending: the lead is preparing version 2");
        await BrowserFixture.ScreenshotAsync(board, "cycle-revision-pending");

        IPage lead = await browser.SignedInPageAsync("maren.holt@tarnby.example", "Maren Holt", RoleNames.ProjectLead, DemoScenario.Password);
        await lead.GotoAsync(browser.App.BaseAddress + $"proposals/{proposalId}");
        await lead.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(lead.GetByTestId("revision-pending")).ToContainTextAsync("the board reviews version 1");
        await lead.GetByTestId("resubmit").ClickAsync();
        await Assertions.Expect(lead.GetByTestId("editor-message")).ToContainTextAsync("version 2 replaces version 1");
        await Assertions.Expect(lead.GetByTestId("revision-pending")).ToHaveCountAsync(0);

        // The pages share one browser context, whose cookies now are the lead's: the board member signs in again.
        board = await BoardPageAsync($"cycles/{cycle}");
        await BrowserFixture.ScreenshotAsync(board, "cycle-after-resubmission");
        await Assertions.Expect(board.GetByTestId("revision-pending")).ToHaveCountAsync(0);
        await Assertions.Expect(board.GetByTestId("cycle-proposals")).ToContainTextAsync("Paint shop extraction with carbon filters v2");
    }
}
