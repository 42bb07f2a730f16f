using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// Inputs of the risk and tax panels that once took the proposal editor down: each gets its message at its field,
/// or its figures, and the page stays live (it still saves) with nothing but warnings in the server's log.
/// </summary>
public sealed class EditorInputsInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private async Task<IPage> ForkliftDraftAsync()
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
        return page;
    }

    /// <summary>Adds a parameter after those the draft already has (the class's tests share the demo draft) and returns its index.</summary>
    private static async Task<int> ParameterAsync(IPage page, string target, string low, string likely, string high)
    {
        int k = await page.GetByTestId("risk-parameters").Locator("tbody tr").CountAsync();
        await page.GetByTestId("add-parameter").ClickAsync();
        await page.Locator($"#risk-target-{k}").SelectOptionAsync(target);
        // Choosing the input fills in a first guess from the server; typed before it lands, a value would be typed into
        // the guess ("8" becoming "88") on a busy machine, which no person is quick enough to do.
        await Assertions.Expect(page.Locator($"#risk-likely-{k}")).Not.ToHaveValueAsync("");
        foreach (var (field, value) in new[] { ("low", low), ("likely", likely), ("high", high) })
        {
            await page.Locator($"#risk-{field}-{k}").FillAsync(value);
            await page.Locator($"#risk-{field}-{k}").BlurAsync();
            await Assertions.Expect(page.Locator($"#risk-{field}-{k}")).ToHaveValueAsync(value);
        }
        return k;
    }

    /// <summary>The page is still live: the parameter tried is removed, a save goes through and no circuit failed.</summary>
    private async Task StillLiveAsync(IPage page, int removeParameter)
    {
        await page.GetByRole(AriaRole.Button, new() { Name = $"Remove parameter {removeParameter + 1}" }).ClickAsync();
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await Assertions.Expect(page.Locator("#blazor-error-ui")).ToBeHiddenAsync();
        Assert.Equal("", browser.App.Log.Errors());
    }

    [Fact]
    public async Task A_life_the_elements_outrun_is_named_at_the_low_value()
    {
        IPage page = await ForkliftDraftAsync();
        int k = await ParameterAsync(page, "horizon", "8", "10", "12");
        // The diesel saving runs to year 10: a life of 8 leaves it past the end.
        await Assertions.Expect(page.Locator($"#risk-low-{k}-error")).ToContainTextAsync("Low: at 8 the model cannot be evaluated");
        await Assertions.Expect(page.Locator($"#risk-low-{k}")).ToHaveAttributeAsync("aria-invalid", "true");
        await Assertions.Expect(page.GetByTestId("risk-errors")).Not.ToContainTextAsync("risk.parameters");
        await StillLiveAsync(page, removeParameter: k);
    }

    [Fact]
    public async Task A_last_period_past_the_life_is_named_at_the_high_value()
    {
        IPage page = await ForkliftDraftAsync();
        int k = await ParameterAsync(page, "elements[#e3].last", "8", "10", "12");
        await Assertions.Expect(page.Locator($"#risk-high-{k}-error")).ToContainTextAsync("High: at 12 the model cannot be evaluated");
        await StillLiveAsync(page, removeParameter: k);
    }

    [Fact]
    public async Task A_marr_typed_in_percent_is_read_in_percent()
    {
        IPage page = await ForkliftDraftAsync();
        int k = await ParameterAsync(page, "rate", "7", "9", "12");
        // Read as 7 to 12 %, not 700 to 1,200 %: the forklifts break even at a MARR in percent, within a sane range.
        var row = page.GetByTestId("tornado-table").Locator("tbody tr").Nth(k);
        await Assertions.Expect(row.Locator("td").Last).ToContainTextAsync("%");
        await Assertions.Expect(page.GetByTestId("risk-errors")).ToHaveCountAsync(0);
        await page.GetByTestId("run-simulation").ClickAsync();
        await Assertions.Expect(page.GetByTestId("risk-message")).ToContainTextAsync("trials run with seed");
        await Assertions.Expect(page.Locator("#pw-histogram .main-svg").First).ToBeVisibleAsync();
        await StillLiveAsync(page, removeParameter: k);
    }

    [Fact]
    public async Task A_growth_after_tax_typed_in_percent_is_read_in_percent()
    {
        IPage page = await ForkliftDraftAsync();
        await page.Locator("#tax-enabled").CheckAsync();
        int k = await ParameterAsync(page, "elements[#e3].growth", "0", "3.5", "7");
        await Assertions.Expect(page.GetByTestId("tornado-table").Locator("tbody tr")).ToHaveCountAsync(k + 1);
        await page.GetByTestId("run-simulation").ClickAsync();
        await Assertions.Expect(page.GetByTestId("risk-message")).ToContainTextAsync("trials run with seed");
        await Assertions.Expect(page.Locator("#pw-cumulative .main-svg").First).ToBeVisibleAsync();
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=risk-heading]"), "risk-growth-after-tax");
        await Assertions.Expect(page.Locator("#tax-enabled")).ToBeCheckedAsync();
        await page.Locator("#tax-enabled").UncheckAsync();
        await StillLiveAsync(page, removeParameter: k);
    }

    [Fact]
    public async Task The_editor_shows_the_cash_flow_diagram_of_the_model_on_the_page()
    {
        IPage page = await ForkliftDraftAsync();
        await Assertions.Expect(page.Locator("#cash-flow-diagram-plot .main-svg").First).ToBeVisibleAsync();
        // The forklifts' largest payment is the trucks and the charging bay now: 186,000 + 24,000.
        await Assertions.Expect(page.GetByTestId("editor-diagram")).ToContainTextAsync("210,000");
        await page.Locator("#el-1-amount").FillAsync("-30000");
        await page.Locator("#el-1-amount").BlurAsync();
        await Assertions.Expect(page.GetByTestId("editor-diagram")).ToContainTextAsync("216,000");
    }
}
