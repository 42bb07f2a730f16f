using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Runs;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// A long simulation started in the proposal editor stops when its tab is closed: at once, not when the server lets
/// the page's circuit go minutes later (Blazor keeps a disconnected circuit for three).
/// </summary>
public sealed class RunsInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task Closing_the_tab_stops_its_simulation_and_gives_its_place_back()
    {
        const string email = "runs.lead@tarnby.example";
        await browser.App.UserAsync(email, "Runa Lead", RoleNames.ProjectLead);
        int draftId;
        using (var scope = browser.App.Services.CreateScope())
        {
            var lead = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync(email);
            // The life varied over a 1,200-period model: every trial takes the full evaluation, so 500,000 of them
            // (1.2 × 10^9 units of work, within the budget) run far longer than this test waits.
            var draft = await scope.ServiceProvider.GetRequiredService<ProposalService>().CreateDraftAsync(Actor.Of(lead!.Id, "Runa Lead", Role.ProjectLead),
                new ProposalDraft("Long-lived kiln", "", ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions
                {
                    Model = new ModelSpec
                    {
                        Horizon = 1200,
                        PeriodsPerYear = 12,
                        Elements =
                        [
                            new ElementSpec { Type = ElementKind.Single, Label = "Kiln", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
                            new ElementSpec { Type = ElementKind.Uniform, Label = "Gas saved", Category = CashFlowCategory.Revenue, First = 1, Last = 600, Amount = 7_000 },
                        ],
                    },
                    MarrOverride = new MarrOverride(new RateSpec { Value = 0.08 }, "No policy in this test"),
                    Risk = new RiskSpec
                    {
                        Trials = 500_000,
                        Parameters = [new ParameterSpec { Name = "Life", Target = "horizon", Low = 900, MostLikely = 1000, High = 1200 }],
                    },
                }, null), CancellationToken.None);
            draftId = draft.Id;
        }
        var limiter = browser.App.Services.GetRequiredService<RunLimiter>();
        IPage page = await browser.SignedInPageAsync(email, "Runa Lead", RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{draftId}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.GetByTestId("tornado-table").Locator("tbody tr")).ToHaveCountAsync(1, new() { Timeout = 60_000 });
        await page.GetByTestId("run-simulation").ClickAsync();
        await Until(() => limiter.Running == 1, "the simulation to start", page, browser.App.Log);

        await page.CloseAsync();
        // Well inside the three minutes Blazor keeps the circuit: only the dropped connection can have stopped it.
        await Until(() => limiter.Running == 0, "the closed tab's simulation to stop");
    }

    private static async Task Until(Func<bool> condition, string what, IPage? page = null, ServerLog? log = null)
    {
        var waited = System.Diagnostics.Stopwatch.StartNew();
        while (!condition())
        {
            if (waited.Elapsed >= TimeSpan.FromSeconds(30))
            {
                string said = page is null ? "" : await page.Locator("body").InnerTextAsync();
                Assert.Fail($"Waited 30 s for {what}. {said} {log?.Errors(Microsoft.Extensions.Logging.LogLevel.Warning)}");
            }
            await Task.Delay(100);
        }
    }
}
