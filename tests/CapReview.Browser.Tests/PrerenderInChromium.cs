using System.Net;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// A visit to the ranking or the portfolio reads the database once: the first (prerendered) rendering reads, and the
/// live page takes what it read from the persisted state. The simulations and the solver wait for the live page.
/// Counted with an EF Core command interceptor in the app under test (<see cref="DatabaseCommandLog"/>).
/// </summary>
public sealed class PrerenderInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private const string Board = "tove.berg@tarnby.example";

    private async Task<(IPage Page, int Cycle)> BoardAsync()
    {
        var (cycle, _) = await browser.DemoCyclesAsync();
        return (await browser.SignedInPageAsync(Board, "Tove Berg", RoleNames.Reviewer, DemoScenario.Password), cycle);
    }

    /// <summary>Opens the page, waits for the live session and its rows, then for anything late.</summary>
    private async Task VisitAsync(IPage page, string path, string rowTestId)
    {
        browser.App.Database.Clear();
        var console = new System.Collections.Concurrent.ConcurrentQueue<string>();
        page.Console += (_, m) => console.Enqueue(m.Type + ": " + m.Text);
        await page.GotoAsync(browser.App.BaseAddress + path);
        try
        {
            await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        }
        catch (TimeoutException ex)
        {
            throw new TimeoutException("The page never went live. The server logged:" + Environment.NewLine + browser.App.Log.Errors(Microsoft.Extensions.Logging.LogLevel.Warning) + Environment.NewLine + string.Join(Environment.NewLine, console), ex);
        }
        await Assertions.Expect(page.GetByTestId(rowTestId).First).ToBeVisibleAsync();
        await page.WaitForLoadStateAsync(LoadState.NetworkIdle);
        await Task.Delay(500);
    }

    [Fact]
    public async Task One_visit_to_the_ranking_reads_the_cycle_once()
    {
        var (page, cycle) = await BoardAsync();
        // Remember the probability of a loss, so that the visit would simulate if the first rendering were allowed to.
        await VisitAsync(page, $"cycles/{cycle}/ranking", "ranking-row");
        await page.Locator("#show-risk").CheckAsync();
        await Assertions.Expect(page.GetByTestId("ranking-loss").First).Not.ToHaveTextAsync("…");

        await VisitAsync(page, $"cycles/{cycle}/ranking", "ranking-row");
        var log = browser.App.Database;
        Assert.Equal(1, log.ReadsOf("budget_cycle"));
        Assert.Equal(1, log.ReadsOf("marr_policy_version"));
        Assert.Equal(1, log.ReadsOf("proposal"));
        Assert.Equal(1, log.ReadsOf("exclusive_group"));
        Assert.Equal(1, log.ReadsOf("contingency"));
        // Nothing else is read twice: the only repeated text is the preference lookup (the remembered view, then the
        // mark of the last cycle visited, two rows).
        Assert.All(log.Commands.Where(c => !c.Contains("FROM \"user_preference\"", StringComparison.Ordinal)).GroupBy(c => c), g => Assert.Single(g));
        await Assertions.Expect(page.GetByTestId("ranking-row")).ToHaveCountAsync(7);
        await Assertions.Expect(page.GetByTestId("ranking-loss").Filter(new() { HasText = "%" }).First).ToBeVisibleAsync();
    }

    [Fact]
    public async Task The_first_rendering_neither_simulates_nor_solves()
    {
        var (page, cycle) = await BoardAsync();
        await VisitAsync(page, $"cycles/{cycle}/ranking", "ranking-row");
        await page.Locator("#show-risk").CheckAsync();
        await Assertions.Expect(page.GetByTestId("ranking-loss").First).Not.ToHaveTextAsync("…");

        // The prerendered HTML as the server sends it, with the browser's cookie: figures, but no simulated loss yet.
        var ranking = await page.Context.APIRequest.GetAsync(browser.App.BaseAddress + $"cycles/{cycle}/ranking");
        string html = WebUtility.HtmlDecode(await ranking.TextAsync());
        Assert.Contains("data-testid=\"ranking-row\"", html, StringComparison.Ordinal);
        Assert.Contains("data-testid=\"ranking-loss\">…<", html, StringComparison.Ordinal);
        Assert.DoesNotContain("data-testid=\"ranking-loss\">no risk analysis", html, StringComparison.Ordinal);

        var portfolio = await page.Context.APIRequest.GetAsync(browser.App.BaseAddress + $"cycles/{cycle}/portfolio");
        html = WebUtility.HtmlDecode(await portfolio.TextAsync());
        Assert.Contains("Portfolio: Capital plan 2027", html, StringComparison.Ordinal);
        Assert.Contains("Calculating…", html, StringComparison.Ordinal);
        Assert.DoesNotContain("portfolio-verdict", html, StringComparison.Ordinal);
    }

    [Fact]
    public async Task One_visit_to_the_portfolio_reads_the_cycle_once_and_solves_on_the_live_page()
    {
        var (page, cycle) = await BoardAsync();
        await VisitAsync(page, $"cycles/{cycle}/portfolio", "portfolio-row");
        var log = browser.App.Database;
        Assert.Equal(1, log.ReadsOf("budget_cycle"));
        Assert.Equal(1, log.ReadsOf("proposal"));
        Assert.Equal(1, log.ReadsOf("exclusive_group"));
        await Assertions.Expect(page.GetByTestId("portfolio-verdict")).ToContainTextAsync("Proven optimal.");
    }
}
