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
        foreach (var (field, value) in new[] { ("low", low), ("likely", likely), ("high", high) })
        {
            await page.Locator($"#risk-{field}-{k}").FillAsync(value);
            await page.Locator($"#risk-{field}-{k}").BlurAsync();
        }
        return k;
    }

    /// <summary>The page is still live: a save goes through and no circuit failed.</summary>
    private async Task StillLiveAsync(IPage page)
    {
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await Assertions.Expect(page.Locator("#blazor-error-ui")).ToBeHiddenAsync();
        Assert.Equal("", browser.App.Log.Errors());
    }

    [Fact]
    public async Task A_life_the_elements_outrun_is_named_at_the_low_value()
    {
        IPage page = await ForkliftDraftAsync();
        await ParameterAsync(page, "horizon", "8", "10", "12");
        await page.WaitForTimeoutAsync(3000);
        if (await page.GetByTestId("run-simulation").IsEnabledAsync())
        {
            await page.GetByTestId("run-simulation").ClickAsync();
            await page.WaitForTimeoutAsync(5000);
        }
        await BrowserFixture.ScreenshotAsync(page, "probe-horizon");
        await StillLiveAsync(page);
    }

    [Fact]
    public async Task A_last_period_past_the_life_is_named_at_the_high_value()
    {
        IPage page = await ForkliftDraftAsync();
        await ParameterAsync(page, "elements[#e3].last", "8", "10", "12");
        await page.WaitForTimeoutAsync(3000);
        if (await page.GetByTestId("run-simulation").IsEnabledAsync())
        {
            await page.GetByTestId("run-simulation").ClickAsync();
            await page.WaitForTimeoutAsync(5000);
        }
        await BrowserFixture.ScreenshotAsync(page, "probe-last");
        await StillLiveAsync(page);
    }

    [Fact]
    public async Task A_marr_typed_in_percent_is_read_in_percent()
    {
        IPage page = await ForkliftDraftAsync();
        await ParameterAsync(page, "rate", "7", "9", "12");
        await page.WaitForTimeoutAsync(3000);
        if (await page.GetByTestId("run-simulation").IsEnabledAsync())
        {
            await page.GetByTestId("run-simulation").ClickAsync();
            await page.WaitForTimeoutAsync(5000);
        }
        await BrowserFixture.ScreenshotAsync(page, "probe-rate");
        await StillLiveAsync(page);
    }

    [Fact]
    public async Task A_growth_after_tax_typed_in_percent_is_read_in_percent()
    {
        IPage page = await ForkliftDraftAsync();
        await page.Locator("#tax-enabled").CheckAsync();
        await ParameterAsync(page, "elements[#e3].growth", "0", "3.5", "7");
        await page.WaitForTimeoutAsync(3000);
        if (await page.GetByTestId("run-simulation").IsEnabledAsync())
        {
            await page.GetByTestId("run-simulation").ClickAsync();
            await page.WaitForTimeoutAsync(5000);
        }
        await BrowserFixture.ScreenshotAsync(page, "probe-growth");
        await StillLiveAsync(page);
    }
}
