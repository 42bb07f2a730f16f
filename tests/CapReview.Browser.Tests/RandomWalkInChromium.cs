using System.Globalization;
using CapReview.Browser.Tests.Walk;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// A lead's random walk through the proposal editor: several hundred random but valid-looking actions (elements of
/// every shape added, removed, reordered and typed in; tax on and off; risk parameters on every input, low, most likely
/// and high in every order, distributions, correlations, scenarios; simulations run and cancelled). The page must never
/// fail and the server must log no error. The seed comes from CAPREVIEW_WALK_SEED (a fixed one by default) and a
/// failure prints it with every action so far; CAPREVIEW_WALK_STEPS changes the length.
/// </summary>
public sealed class RandomWalkInChromium(BrowserFixture browser, Xunit.Abstractions.ITestOutputHelper output) : IClassFixture<BrowserFixture>
{
    private const int DefaultSeed = 20271;
    private const int DefaultSteps = 300;

    private static int Setting(string name, int fallback) =>
        int.TryParse(Environment.GetEnvironmentVariable(name), NumberStyles.Integer, CultureInfo.InvariantCulture, out int value) ? value : fallback;

    [Fact]
    public async Task Hundreds_of_random_edits_never_break_the_editor()
    {
        int seed = Setting("CAPREVIEW_WALK_SEED", DefaultSeed);
        int steps = Setting("CAPREVIEW_WALK_STEPS", DefaultSteps);
        const string email = "walk.lead@tarnby.example";
        await browser.App.UserAsync(email, "Walker Lead", RoleNames.ProjectLead);
        int id;
        using (var scope = browser.App.Services.CreateScope())
        {
            var lead = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync(email);
            var draft = await scope.ServiceProvider.GetRequiredService<ProposalService>().CreateDraftAsync(Actor.Of(lead!.Id, "Walker Lead", Role.ProjectLead),
                new ProposalDraft("Press line retrofit", "", ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions
                {
                    Model = new ModelSpec
                    {
                        Horizon = 10,
                        Elements =
                        [
                            new ElementSpec { Id = "e1", Type = ElementKind.Single, Label = "First cost", Category = CashFlowCategory.Capital, Period = 0, Amount = -240_000 },
                            new ElementSpec { Id = "e2", Type = ElementKind.Uniform, Label = "Labour saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 52_000 },
                            new ElementSpec { Id = "e3", Type = ElementKind.Geometric, Label = "Energy saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 6_000, Growth = 0.02 },
                        ],
                    },
                    MarrOverride = new MarrOverride(new RateSpec { Value = 0.1 }, "No policy in this test"),
                }, null), CancellationToken.None);
            id = draft.Id;
        }
        IPage page = await browser.SignedInPageAsync(email, "Walker Lead", RoleNames.ProjectLead);
        page.SetDefaultTimeout(20_000);
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{id}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });

        var walk = new EditorWalk(page, seed);
        walk.Starts(("Single", "First cost", 1), ("Uniform", "Labour saved", 10), ("Geometric", "Energy saved", 10));
        for (int step = 1; step <= steps; step++)
        {
            try
            {
                await walk.StepAsync(step);
            }
            catch (Exception ex) when (ex is not Xunit.Sdk.XunitException)
            {
                await FailAsync(page, walk, seed, $"step {step} could not be done: {ex.Message}");
            }
            await CheckAsync(page, walk, seed, step);
        }
        // A simulation still going ends (or is refused) without harm.
        await Assertions.Expect(page.Locator("section[aria-labelledby=risk-heading]").GetByRole(AriaRole.Button, new() { Name = "Cancel", Exact = true }))
            .ToHaveCountAsync(0, new() { Timeout = 60_000 });
        await CheckAsync(page, walk, seed, steps);
        await BrowserFixture.ScreenshotAsync(page, "random-walk-end");
        output.WriteLine($"CAPREVIEW_WALK_SEED={seed}, {walk.Runs} simulations started" + Environment.NewLine + string.Join(Environment.NewLine, walk.Log));
        Assert.True(walk.Runs > 0, $"CAPREVIEW_WALK_SEED={seed} never ran a simulation: the walk leaves its risk inputs broken.");
    }

    private async Task CheckAsync(IPage page, EditorWalk walk, int seed, int step)
    {
        int failures = await page.Locator("[data-testid=page-failure], #blazor-error-ui:visible, #components-reconnect-modal:visible").CountAsync()
            + await page.GetByText("Something went wrong").Filter(new() { Visible = true }).CountAsync();
        if (failures > 0)
        {
            await FailAsync(page, walk, seed, $"the page failed after step {step}");
        }
        if (browser.App.Log.Errors().Length > 0)
        {
            await FailAsync(page, walk, seed, $"the server logged an error by step {step}");
        }
    }

    private async Task FailAsync(IPage page, EditorWalk walk, int seed, string what)
    {
        await BrowserFixture.ScreenshotAsync(page, $"random-walk-{seed}");
        string shown = string.Join(" | ", await page.Locator("[data-testid=page-failure], .field-error, [data-testid=editor-message]").AllInnerTextsAsync());
        Assert.Fail($"""
            Random walk with CAPREVIEW_WALK_SEED={seed}: {what}.
            On the page: {shown}
            Actions:
            {string.Join(Environment.NewLine, walk.Log)}
            Server log:
            {browser.App.Log.Errors(Microsoft.Extensions.Logging.LogLevel.Warning)}
            """);
    }
}
