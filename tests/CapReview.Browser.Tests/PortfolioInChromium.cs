using System.Globalization;
using System.Text.RegularExpressions;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>A board member works through the demo cycle's ranking, portfolio and a replacement's timing in Chromium.</summary>
public sealed partial class PortfolioInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private const string Board = "tove.berg@tarnby.example";

    /// <summary>The demo's open cycle and the references of its solar array and its line 3 replacement.</summary>
    private async Task<(int Cycle, string Solar, int Replacement)> DemoAsync()
    {
        using var scope = browser.App.Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
        var cycle = (await scope.ServiceProvider.GetRequiredService<CycleService>().ListAsync(CancellationToken.None)).Single(c => c.Name == "Capital plan 2027");
        var actor = CapReview.Reviews.Access.Actor.Of("lookup", "Lookup", CapReview.Reviews.Access.Role.Reviewer);
        var proposals = await scope.ServiceProvider.GetRequiredService<ProposalService>().ListInCycleAsync(actor, cycle.Id, CancellationToken.None);
        return (cycle.Id, proposals.Single(p => p.Title.StartsWith("Rooftop solar", StringComparison.Ordinal)).Reference,
            proposals.Single(p => p.Title == "CNC line 3 replacement").Id);
    }

    private async Task<IPage> BoardPageAsync(string path)
    {
        IPage page = await browser.SignedInPageAsync(Board, "Tove Berg", RoleNames.Reviewer, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + path);
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        return page;
    }

    private static double Money(string text) => double.Parse(text.Replace("−", "-", StringComparison.Ordinal), NumberStyles.Number, CultureInfo.GetCultureInfo("en-IE"));

    [Fact]
    public async Task The_ranking_sorts_filters_and_shows_the_rules_and_charts()
    {
        var (cycle, solar, _) = await DemoAsync();
        IPage page = await BoardPageAsync($"cycles/{cycle}/ranking");
        ILocator rows = page.GetByTestId("ranking-row");
        await Assertions.Expect(rows).ToHaveCountAsync(7);
        var worths = (await page.GetByTestId("ranking-aw").AllInnerTextsAsync()).Select(Money).ToList();
        Assert.Equal(worths.OrderDescending(), worths);
        await Assertions.Expect(page.GetByTestId("ranking-table")).ToContainTextAsync("Line 3 capacity");
        await Assertions.Expect(page.GetByTestId("ranking-table")).ToContainTextAsync($"needs {solar}");
        await Assertions.Expect(page.Locator("#aw-bars .main-svg").First).ToBeVisibleAsync();
        await Assertions.Expect(page.Locator("#cost-worth-bubbles .main-svg").First).ToBeVisibleAsync();
        // The line 3 group is compared at the higher MARR of its two proposals (the replacement is high risk: 12%).
        await Assertions.Expect(page.GetByTestId("group-choice").First).ToContainTextAsync("12.00 %");
        await Assertions.Expect(page.GetByTestId("incremental-steps").First.Locator("tbody tr")).ToHaveCountAsync(2);
        await BrowserFixture.ScreenshotAsync(page, "ranking");

        await page.GetByTestId("sort-cost").ClickAsync();
        await Assertions.Expect(page.Locator("th[aria-sort=ascending]")).ToContainTextAsync("First cost");
        await page.Locator("#filter-category").SelectOptionAsync("Compliance");
        await Assertions.Expect(rows).ToHaveCountAsync(2);
        await page.Locator("#filter-category").SelectOptionAsync("");
        // The solar array carries a risk analysis (seed 2027): its probability of a loss shows beside it.
        await page.Locator("#show-risk").CheckAsync();
        await Assertions.Expect(page.GetByTestId("ranking-row").Filter(new() { HasText = "Rooftop solar" }).GetByTestId("ranking-loss")).ToContainTextAsync("%");
        await page.Locator("#marr-shift").SelectOptionAsync("2");
        await Assertions.Expect(page.GetByTestId("ranking-basis")).ToContainTextAsync("raised by 2 points");
        await Assertions.Expect(page.GetByTestId("swap-result")).ToContainTextAsync("P-");
    }

    [Fact]
    public async Task The_portfolio_respects_the_rules_answers_a_what_if_and_exports()
    {
        var (cycle, _, _) = await DemoAsync();
        IPage page = await BoardPageAsync($"cycles/{cycle}/portfolio");
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("Proven optimal.");
        await Assertions.Expect(page.GetByTestId("portfolio-greedy")).ToContainTextAsync("Filling the budget down the ranking");
        var funded = await page.Locator("[data-testid=portfolio-row][data-funded=yes]").AllInnerTextsAsync();
        // The mandatory paint-shop group funds exactly one way; the battery only with the array.
        Assert.Equal(1, funded.Count(f => f.Contains("Paint shop", StringComparison.Ordinal)));
        Assert.True(!funded.Any(f => f.Contains("Battery", StringComparison.Ordinal)) || funded.Any(f => f.Contains("solar array, dispatch", StringComparison.Ordinal)));
        Assert.True(funded.Count(f => f.Contains("CNC line 3", StringComparison.Ordinal)) <= 1);
        // The basis unequal lives are compared on, as the group's incremental analysis compares them.
        await Assertions.Expect(page.GetByTestId("portfolio-basis")).ToContainTextAsync("the alternatives of a group over the least common multiple of their lives");
        await Assertions.Expect(page.Locator("#frontier .main-svg").First).ToBeVisibleAsync();
        await BrowserFixture.ScreenshotAsync(page, "portfolio");

        // The portfolio's risk: the solar array's estimates vary (its own seed); the chance each proposal is funded.
        await page.Locator("#portfolio-trials").FillAsync("300");
        await page.GetByTestId("simulate-portfolio").ClickAsync();
        await Assertions.Expect(page.GetByTestId("top-changes")).ToContainTextAsync("In 300 trials");
        await Assertions.Expect(page.GetByTestId("funded-probability").Locator("tbody tr")).ToHaveCountAsync(7);

        await page.Locator("#capital-limit").FillAsync("600000");
        await page.GetByTestId("recalculate").ClickAsync();
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("within 600,000");
        var cost = FirstCost().Match(await page.GetByTestId("portfolio-verdict").InnerTextAsync());
        Assert.True(Money(cost.Groups[1].Value) <= 600_000);

        var csv = await page.APIRequest.GetAsync(browser.App.BaseAddress + $"cycles/{cycle}/portfolio/csv?limit=600000");
        Assert.Equal(200, csv.Status);
        string text = await csv.TextAsync();
        Assert.StartsWith("Rank,Reference,Title,", text.TrimStart('\uFEFF'), StringComparison.Ordinal);
        Assert.Contains("Rank,Reference,Title,", text, StringComparison.Ordinal);
        // Removing a rule asks first; keeping it changes nothing.
        await page.GetByTestId("contingencies").GetByRole(AriaRole.Button, new() { Name = "Remove" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("contingencies")).ToContainTextAsync("Remove this contingency?");
        await page.GetByTestId("contingencies").GetByRole(AriaRole.Button, new() { Name = "Keep it" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("contingencies").Locator("li")).ToHaveCountAsync(1);

        var xlsx = await page.APIRequest.GetAsync(browser.App.BaseAddress + $"cycles/{cycle}/portfolio/xlsx");
        Assert.Equal("PK", System.Text.Encoding.ASCII.GetString((await xlsx.BodyAsync())[..2]));
    }

    [Fact]
    public async Task A_replacement_shows_the_cost_by_retirement_year_and_the_advice()
    {
        var (_, _, replacement) = await DemoAsync();
        IPage page = await BoardPageAsync($"proposals/{replacement}/replacement");
        await page.GetByTestId("replacement-advice").WaitForAsync();
        await Assertions.Expect(page.GetByTestId("replacement-advice")).ToContainTextAsync("Keep for 1 more year, then replace.");
        await Assertions.Expect(page.Locator("#service-life .main-svg").First).ToBeVisibleAsync();
        await Assertions.Expect(page.GetByTestId("challenger-table").Locator("tbody tr")).ToHaveCountAsync(12);
        await BrowserFixture.ScreenshotAsync(page, "replacement");
    }

    [Fact]
    public async Task Finance_downloads_last_years_signed_packets()
    {
        using (var scope = browser.App.Services.CreateScope())
        {
            await scope.ServiceProvider.GetRequiredService<DemoScenario>().EnsureAsync(CancellationToken.None);
        }
        int decided;
        using (var scope = browser.App.Services.CreateScope())
        {
            decided = (await scope.ServiceProvider.GetRequiredService<CycleService>().ListAsync(CancellationToken.None)).Single(c => c.Name == "Capital plan 2026").Id;
        }
        IPage page = await browser.SignedInPageAsync("rui.costa@tarnby.example", "Rui Costa", RoleNames.Finance, DemoScenario.Password);
        await page.GotoAsync(browser.App.BaseAddress + $"cycles/{decided}");
        await Assertions.Expect(page.GetByTestId("packets").Locator("tbody tr")).ToHaveCountAsync(4);
        string href = (await page.GetByTestId("packets").Locator("a").Last.GetAttributeAsync("href"))!;
        var pdf = await page.APIRequest.GetAsync(browser.App.BaseAddress + href);
        Assert.Equal("%PDF", System.Text.Encoding.ASCII.GetString((await pdf.BodyAsync())[..4]));
        await BrowserFixture.ScreenshotAsync(page, "decided-cycle-packets");
    }

    [GeneratedRegex(@"first cost of ([\d,]+)")]
    private static partial Regex FirstCost();
}
