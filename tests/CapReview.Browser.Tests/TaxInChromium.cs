using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>A lead puts the demo's forklift draft on an after-tax basis with MACRS, adds a risk analysis, saves it and finds it again.</summary>
public sealed class TaxInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task A_lead_sets_taxes_and_depreciation_and_sees_the_after_tax_table()
    {
        int draftId;
        using (var scope = browser.App.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
            var oskar = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("oskar.lind@tarnby.example");
            var own = await scope.ServiceProvider.GetRequiredService<ProposalService>().ListOwnAsync(Actor.Of(oskar!.Id, "Oskar Lind", Role.ProjectLead), CancellationToken.None);
            draftId = own.Single(p => p.Title == "Forklift fleet electrification").Id;
        }
        IPage page = await browser.SignedInPageAsync("oskar.lind@tarnby.example", "Oskar Lind", RoleNames.ProjectLead, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{draftId}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.GetByTestId("tax-caution")).ToContainTextAsync("Tax rules vary by jurisdiction");
        await page.Locator("#tax-enabled").CheckAsync();
        await page.Locator("#macrs-class").SelectOptionAsync("FiveYear");
        await Assertions.Expect(page.GetByTestId("after-tax-table").Locator("tbody tr")).ToHaveCountAsync(11);
        await Assertions.Expect(page.GetByTestId("after-tax-present")).Not.ToBeEmptyAsync();
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await BrowserFixture.ScreenshotAsync(page, "proposal-after-tax");

        await page.ReloadAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.Locator("#tax-enabled")).ToBeCheckedAsync();
        await Assertions.Expect(page.Locator("#macrs-class")).ToHaveValueAsync("FiveYear");

        // The risk panel: the diesel saving is uncertain; the tornado, the simulation, and the parameter kept with the draft.
        // Inputs are named by the element's identity: the demo's elements were stored with e1, e2, e3.
        await page.GetByTestId("add-parameter").ClickAsync();
        await page.Locator("#risk-target-0").SelectOptionAsync("elements[#e3].amount");
        await Assertions.Expect(page.GetByTestId("tornado-table").Locator("tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(page.GetByTestId("scenarios-table")).ToContainTextAsync("Pessimistic");
        await page.Locator("#risk-trials").FillAsync("20000");
        await page.GetByTestId("run-simulation").ClickAsync();
        await Assertions.Expect(page.GetByTestId("probability-of-loss")).ToContainTextAsync("%");
        await Assertions.Expect(page.GetByTestId("risk-message")).ToContainTextAsync("20,000 trials run with seed 2027");
        await Assertions.Expect(page.Locator("#pw-histogram .main-svg").First).ToBeVisibleAsync();
        await Assertions.Expect(page.Locator("#pw-cumulative .main-svg").First).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("spider-table").Locator("tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(page.Locator("#spider .main-svg").First).ToBeVisibleAsync();
        await BrowserFixture.ScreenshotAsync(page, "proposal-risk");
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=risk-heading]"), "risk-panel");
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await page.ReloadAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.Locator("#risk-target-0")).ToHaveValueAsync("elements[#e3].amount");
    }

    [Fact]
    public async Task After_tax_a_later_capital_cost_can_be_marked_as_a_repair_and_the_mark_is_kept()
    {
        int draftId;
        using (var scope = browser.App.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
            var oskar = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("oskar.lind@tarnby.example");
            var own = await scope.ServiceProvider.GetRequiredService<ProposalService>().ListOwnAsync(Actor.Of(oskar!.Id, "Oskar Lind", Role.ProjectLead), CancellationToken.None);
            draftId = own.Single(p => p.Title == "Forklift fleet electrification").Id;
        }
        IPage page = await browser.SignedInPageAsync("oskar.lind@tarnby.example", "Oskar Lind", RoleNames.ProjectLead, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{draftId}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await page.Locator("#tax-enabled").CheckAsync();
        await Assertions.Expect(page.GetByTestId("outlay-note")).ToContainTextAsync("depreciated by the same method");
        // The battery replacement at year 6 (element 5) takes the box; the trucks and the charging bay at period 0 do not.
        await Assertions.Expect(page.Locator("[id$='-expensed']")).ToHaveCountAsync(1);
        await Assertions.Expect(page.Locator("#el-4-expensed")).Not.ToBeCheckedAsync();
        await page.Locator("#el-4-expensed").CheckAsync();
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=elements-heading]"), "elements-repair-mark");

        await page.ReloadAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.Locator("#el-4-expensed")).ToBeCheckedAsync();
        await page.Locator("#el-4-expensed").UncheckAsync();
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
    }
}
