using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// A board member on the cycle page: approves the selected portfolio although it breaks the capital limit beside an
/// earlier approval (only with the override and its reason), then changes that earlier approval to a return for changes.
/// </summary>
public sealed class DecisionPanelInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private const string LeadEmail = "decisions.lead@tarnby.example";

    /// <summary>A cycle of 250,000 with three submitted proposals, the conveyor approved on its own.</summary>
    private async Task<int> CycleAsync()
    {
        await browser.App.UserAsync(LeadEmail, "Dana Lead", RoleNames.ProjectLead);
        using var scope = browser.App.Services.CreateScope();
        var admin = Actor.Of("setup", "Setup", Role.Administrator);
        var marr = await scope.ServiceProvider.GetRequiredService<MarrPolicyService>()
            .AddVersionAsync(admin, new NewMarrPolicy(0.10, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Decision panel test policy"), CancellationToken.None);
        var cycle = await scope.ServiceProvider.GetRequiredService<CycleService>()
            .CreateAsync(admin, new NewBudgetCycle("Decision panel 2027", 250_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var user = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync(LeadEmail);
        var lead = Actor.Of(user!.Id, "Dana Lead", Role.ProjectLead);
        var proposals = scope.ServiceProvider.GetRequiredService<ProposalService>();
        var submitted = new List<ProposalView>();
        // At 10 % over 10 years (P/A = 6.1446, handbook tables): A 27,470, B 22,892, C −15,662 present worth; the
        // selection within 250,000 is A and B.
        foreach (var (title, cost, saving) in new[] { ("Compressor A", 120_000.0, 24_000.0), ("Lighting B", 100_000.0, 20_000.0), ("Conveyor C", 200_000.0, 30_000.0) })
        {
            var draft = await proposals.CreateDraftAsync(lead, Draft(title, cost, saving), CancellationToken.None);
            submitted.Add(await proposals.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None));
        }
        await scope.ServiceProvider.GetRequiredService<DecisionService>().DecideAsync(Actor.Of("board-setup", "Setup Board", Role.Reviewer),
            new DecisionRequest(submitted[2].Id, DecisionOutcome.Approve, "", cycle.Id, 1, null), CancellationToken.None);
        return cycle.Id;
    }

    private static ProposalDraft Draft(string title, double cost, double saving) => new(title, "", ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions
    {
        Model = new ModelSpec
        {
            Horizon = 10,
            Elements =
            [
                new ElementSpec { Id = "e1", Type = ElementKind.Single, Label = "Equipment", Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
                new ElementSpec { Id = "e2", Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving },
            ],
        },
    }, null);

    [Fact]
    public async Task The_portfolio_is_approved_with_an_override_and_an_approval_is_changed_to_a_return_for_changes()
    {
        int cycleId = await CycleAsync();
        IPage board = await browser.SignedInPageAsync("vera.board@tarnby.example", "Vera Board", RoleNames.Reviewer);
        await board.GotoAsync(browser.App.BaseAddress + $"cycles/{cycleId}");
        await board.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });

        await board.GetByRole(AriaRole.Button, new() { Name = "Approve the selected portfolio" }).ClickAsync();
        ILocator confirm = board.GetByTestId("confirm-portfolio");
        await Assertions.Expect(confirm.GetByTestId("portfolio-approvals").Locator("li")).ToContainTextAsync(
            ["Compressor A, version 1, first cost 120,000", "Lighting B, version 1, first cost 100,000"], new() { Timeout = 30_000 });
        // 200,000 approved before, with 120,000 and 100,000: 420,000 against the cycle's 250,000.
        await Assertions.Expect(confirm.GetByTestId("broken-rules")).ToContainTextAsync("Record despite breaking the rule: The approved first cost stays within the capital limit of the cycle's budget year (420,000 approved against a limit of 250,000)");
        ILocator yes = confirm.GetByRole(AriaRole.Button, new() { Name = "Yes, approve these 2" });
        await Assertions.Expect(yes).ToBeDisabledAsync();
        await confirm.GetByRole(AriaRole.Checkbox).CheckAsync();
        await Assertions.Expect(yes).ToBeDisabledAsync();
        await confirm.Locator("#portfolio-reason").FillAsync("The conveyor is funded from the plant's own budget");
        await Assertions.Expect(yes).ToBeEnabledAsync();
        await BrowserFixture.ScreenshotAsync(board, "portfolio-override");
        await yes.ClickAsync();
        await Assertions.Expect(board.GetByTestId("cycle-message")).ToContainTextAsync("the selected portfolio, overriding the board's rules; the override and its reason are in the record.");
        await Assertions.Expect(board.GetByTestId("cycle-row").Filter(new() { HasText = "Compressor A" })).ToContainTextAsync("Approved");
        await Assertions.Expect(board.GetByTestId("cycle-row").Filter(new() { HasText = "Lighting B" })).ToContainTextAsync("Approved");
        await Assertions.Expect(board.GetByTestId("budget-year")).ToContainTextAsync("420,000");

        ILocator conveyor = board.GetByTestId("cycle-row").Filter(new() { HasText = "Conveyor C" });
        await conveyor.GetByRole(AriaRole.Combobox).SelectOptionAsync(new SelectOptionValue { Label = "Return for changes" });
        await conveyor.GetByRole(AriaRole.Textbox).FillAsync("Quote a shorter conveyor");
        await conveyor.GetByRole(AriaRole.Button, new() { Name = "Record" }).ClickAsync();
        ILocator decision = board.GetByTestId("confirm-decision");
        await Assertions.Expect(decision).ToContainTextAsync("Record a return for changes on");
        await Assertions.Expect(decision).ToContainTextAsync("It supersedes the decision recorded before");
        await Assertions.Expect(decision.GetByTestId("return-explained")).ToContainTextAsync("goes back to its lead for changes, with this comment from the board");
        // Returning the conveyor leaves 220,000 approved: no rule broken, no override asked.
        await Assertions.Expect(decision.GetByTestId("rule-override")).ToHaveCountAsync(0);
        await BrowserFixture.ScreenshotAsync(board, "decision-changed-to-return");
        await decision.GetByRole(AriaRole.Button, new() { Name = "Yes, record" }).ClickAsync();
        await Assertions.Expect(board.GetByTestId("cycle-message")).ToContainTextAsync("returned to its lead for changes; the decision it had is superseded.");
        await Assertions.Expect(conveyor).ToContainTextAsync("Returned for changes");
        await Assertions.Expect(conveyor.GetByRole(AriaRole.Combobox)).ToHaveCountAsync(0);
        await Assertions.Expect(conveyor.GetByTestId("with-lead")).ToHaveTextAsync("With its lead for changes: the board decides it again once it is resubmitted.");
        await Assertions.Expect(board.GetByTestId("budget-year")).ToContainTextAsync("220,000");
        await BrowserFixture.ScreenshotAsync(board, "decision-returned");

        // The lead finds what the board asks for on the proposal itself.
        int conveyorId;
        using (var scope = browser.App.Services.CreateScope())
        {
            var decisions = await scope.ServiceProvider.GetRequiredService<DecisionService>()
                .DecisionsAsync(Actor.Of("board-setup", "Setup Board", Role.Reviewer), cycleId, CancellationToken.None);
            conveyorId = decisions.First(d => d.Outcome == DecisionOutcome.ReturnForChanges).ProposalId;
        }
        IPage lead = await browser.SignedInPageAsync(LeadEmail, "Dana Lead", RoleNames.ProjectLead);
        await lead.GotoAsync(browser.App.BaseAddress + $"proposals/{conveyorId}");
        await Assertions.Expect(lead.GetByTestId("board-return")).ToContainTextAsync("The board returned version 1 for changes on");
        await Assertions.Expect(lead.GetByTestId("board-return").Locator("q")).ToHaveTextAsync("Quote a shorter conveyor");
        await BrowserFixture.ScreenshotAsync(lead.GetByTestId("board-return"), "returned-to-lead");
    }
}
