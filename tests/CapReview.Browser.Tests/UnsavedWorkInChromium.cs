using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// Leaving the proposal editor or the quick evaluation with unsaved changes asks first (a link, a reload, closing the
/// tab), only when there are such changes, and typed work that was left anyway is offered back on return.
/// </summary>
public sealed class UnsavedWorkInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private const string Name = "Una Saved";

    [Fact]
    public async Task A_link_away_from_unsaved_changes_asks_and_staying_keeps_them()
    {
        var (page, id) = await EditorAsync("guard.link@tarnby.example", "Conveyor guards");
        var dialogs = Answer(page, accept: false);
        await page.Locator("#title").FillAsync("Conveyor guards, both lines");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToBeVisibleAsync();

        await page.GetByRole(AriaRole.Link, new() { Name = "My proposals" }).ClickAsync();
        await Until(() => dialogs.Count == 1, "the question before leaving");
        Assert.Equal("confirm", dialogs[0].Type);
        Assert.Contains("unsaved changes", dialogs[0].Message, StringComparison.Ordinal);
        Assert.EndsWith($"proposals/{id}", page.Url, StringComparison.Ordinal);
        await Assertions.Expect(page.Locator("#title")).ToHaveValueAsync("Conveyor guards, both lines");

        // Saved, the same link leaves without a question.
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToHaveCountAsync(0);
        await page.GetByRole(AriaRole.Link, new() { Name = "My proposals" }).ClickAsync();
        await Assertions.Expect(page).ToHaveURLAsync(browser.App.BaseAddress + "proposals");
        Assert.Single(dialogs);
        Assert.Empty(browser.App.Log.Errors());
    }

    [Fact]
    public async Task A_page_without_changes_leaves_without_asking()
    {
        var (page, _) = await EditorAsync("guard.clean@tarnby.example", "Dust extraction");
        var dialogs = Answer(page, accept: false);
        // A click that changes nothing (opening a field and leaving it as it was) is no change.
        await page.Locator("#title").ClickAsync();
        await page.GetByRole(AriaRole.Link, new() { Name = "My proposals" }).ClickAsync();
        await Assertions.Expect(page).ToHaveURLAsync(browser.App.BaseAddress + "proposals");
        Assert.Empty(dialogs);
    }

    [Fact]
    public async Task A_reload_or_a_closed_tab_asks_and_the_work_left_is_offered_back()
    {
        var (page, id) = await EditorAsync("guard.reload@tarnby.example", "Compressor heat recovery");
        var dialogs = Answer(page, accept: false);
        await page.Locator("#el-1-amount").FillAsync("41500");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToContainTextAsync("a copy is kept in this browser");

        // Refused, the reload does not happen and the typed amount stays.
        try
        {
            await page.ReloadAsync(new() { Timeout = 3_000 });
        }
        catch (TimeoutException)
        {
            // The reload was refused at the browser's question.
        }
        await Until(() => dialogs.Count == 1, "the browser's question before the reload");
        Assert.Equal("beforeunload", dialogs[0].Type);
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("41500");

        // Closing the tab asks too; the tab is closed anyway and the copy remains for the next visit.
        var closed = Answer(page, accept: true);
        var context = page.Context;
        await page.CloseAsync(new() { RunBeforeUnload = true });
        await Until(() => closed.Count == 1, "the browser's question before closing the tab");
        Assert.Equal("beforeunload", closed[0].Type);

        page = await context.NewPageAsync();
        await OpenAsync(page, id);
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToContainTextAsync("were not saved");
        await Assertions.Expect(page.GetByTestId("recover-older")).ToHaveCountAsync(0);
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("38000");
        await BrowserFixture.ScreenshotAsync(page, "recover-offer");
        await page.GetByTestId("recover").ClickAsync();
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("41500");
        await Assertions.Expect(page.GetByTestId("editor-message")).ToContainTextAsync("Recovered the unsaved changes");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToBeVisibleAsync();
        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");

        // Saved, nothing is offered again and the stored draft holds the recovered amount.
        await page.ReloadAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("41500");
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToHaveCountAsync(0);
        Assert.Empty(browser.App.Log.Errors());
    }

    [Fact]
    public async Task Discarding_the_kept_changes_shows_the_saved_draft_and_forgets_them()
    {
        var (page, id) = await EditorAsync("guard.discard@tarnby.example", "Paint line filters");
        await page.Locator("#title").FillAsync("Paint line filters, typed and left");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToContainTextAsync("a copy is kept");
        Answer(page, accept: true);
        await OpenAsync(page, id);
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToBeVisibleAsync();
        await page.GetByTestId("discard").ClickAsync();
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToHaveCountAsync(0);
        await Assertions.Expect(page.Locator("#title")).ToHaveValueAsync("Paint line filters");
        await OpenAsync(page, id);
        await Assertions.Expect(page.Locator("#title")).ToHaveValueAsync("Paint line filters");
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToHaveCountAsync(0);
    }

    [Fact]
    public async Task A_copy_older_than_a_later_save_says_so_and_is_never_applied_unasked()
    {
        const string email = "guard.older@tarnby.example";
        var (page, id) = await EditorAsync(email, "Boiler burner");
        await page.Locator("#el-1-amount").FillAsync("12345");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToContainTextAsync("a copy is kept");
        var context = page.Context;
        await page.CloseAsync();

        // Saved elsewhere since (another tab, the API): a newer amount.
        using (var scope = browser.App.Services.CreateScope())
        {
            var actor = await ActorAsync(scope, email);
            var proposals = scope.ServiceProvider.GetRequiredService<ProposalService>();
            var view = await proposals.GetAsync(actor, id, CancellationToken.None);
            await proposals.UpdateDraftAsync(actor, id, view.Revision, Draft("Boiler burner", 50_000), CancellationToken.None);
        }

        page = await context.NewPageAsync();
        await OpenAsync(page, id);
        await Assertions.Expect(page.GetByTestId("recover-older")).ToContainTextAsync("older than the last save");
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("50000");
        await page.GetByTestId("recover").ClickAsync();
        await Assertions.Expect(page.Locator("#el-1-amount")).ToHaveValueAsync("12345");
    }

    [Fact]
    public async Task Signing_out_clears_the_copy_kept_in_the_browser()
    {
        const string email = "guard.signout@tarnby.example";
        var (page, id) = await EditorAsync(email, "Shared terminal");
        await page.Locator("#title").FillAsync("Shared terminal, typed before signing out");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToContainTextAsync("a copy is kept");
        Answer(page, accept: true);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign out" }).ClickAsync();
        await Assertions.Expect(page.Locator("#email")).ToBeVisibleAsync();

        await page.Locator("#email").FillAsync(email);
        await page.Locator("#password").FillAsync(AppHost.Password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync(Name);
        await OpenAsync(page, id);
        await Assertions.Expect(page.Locator("#title")).ToHaveValueAsync("Shared terminal");
        await Assertions.Expect(page.GetByTestId("recover-offer")).ToHaveCountAsync(0);
    }

    [Fact]
    public async Task The_quick_evaluation_asks_before_a_link_leaves_changed_figures()
    {
        IPage page = await browser.SignedInPageAsync("guard.quick@tarnby.example", Name, RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "evaluate");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        var dialogs = Answer(page, accept: true);
        await page.Locator("#el-0-amount").FillAsync("-91500");
        await Assertions.Expect(page.GetByTestId("unsaved")).ToBeVisibleAsync();
        await page.GetByRole(AriaRole.Link, new() { Name = "My proposals" }).ClickAsync();
        await Assertions.Expect(page).ToHaveURLAsync(browser.App.BaseAddress + "proposals");
        Assert.Single(dialogs);
        Assert.Contains("lose them", dialogs[0].Message, StringComparison.Ordinal);
    }

    private async Task<(IPage Page, int Id)> EditorAsync(string email, string title)
    {
        await browser.App.UserAsync(email, Name, RoleNames.ProjectLead);
        int id;
        using (var scope = browser.App.Services.CreateScope())
        {
            var draft = await scope.ServiceProvider.GetRequiredService<ProposalService>()
                .CreateDraftAsync(await ActorAsync(scope, email), Draft(title, 38_000), CancellationToken.None);
            id = draft.Id;
        }
        IPage page = await browser.SignedInPageAsync(email, Name, RoleNames.ProjectLead);
        await OpenAsync(page, id);
        return (page, id);
    }

    private async Task OpenAsync(IPage page, int id)
    {
        await page.GotoAsync(browser.App.BaseAddress + $"proposals/{id}");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
    }

    private static async Task<Actor> ActorAsync(IServiceScope scope, string email)
    {
        var user = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync(email);
        return Actor.Of(user!.Id, Name, Role.ProjectLead);
    }

    private static ProposalDraft Draft(string title, double saving) => new(title, "", ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions
    {
        Model = new ModelSpec
        {
            Horizon = 8,
            Elements =
            [
                new ElementSpec { Id = "e1", Type = ElementKind.Single, Label = "Equipment", Category = CashFlowCategory.Capital, Period = 0, Amount = -150_000 },
                new ElementSpec { Id = "e2", Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 8, Amount = saving },
            ],
        },
        MarrOverride = new MarrOverride(new RateSpec { Value = 0.1 }, "No policy in this test"),
    }, null);

    /// <summary>Answers every dialog of the page from now on (the last call's answer); the list holds what was asked.</summary>
    private static List<(string Type, string Message)> Answer(IPage page, bool accept)
    {
        var answerer = Answerers.GetOrCreateValue(page);
        answerer.Accept = accept;
        if (!answerer.Attached)
        {
            answerer.Attached = true;
            page.Dialog += async (_, dialog) =>
            {
                lock (answerer.Asked)
                {
                    answerer.Asked.Add((dialog.Type, dialog.Message));
                }
                try
                {
                    await (answerer.Accept ? dialog.AcceptAsync() : dialog.DismissAsync());
                }
                catch (PlaywrightException)
                {
                    // The tab closed while its question was open (closing the tab asks too): there is nothing left to answer,
                    // and an exception escaping this event handler would take the whole test run down.
                }
            };
        }
        answerer.Asked.Clear();
        return answerer.Asked;
    }

    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<IPage, Answerer> Answerers = [];

    private sealed class Answerer
    {
        public bool Accept { get; set; }

        public bool Attached { get; set; }

        public List<(string Type, string Message)> Asked { get; } = [];
    }

    private static async Task Until(Func<bool> condition, string what)
    {
        var waited = System.Diagnostics.Stopwatch.StartNew();
        while (!condition())
        {
            if (waited.Elapsed >= TimeSpan.FromSeconds(30))
            {
                Assert.Fail($"Waited 30 s for {what}.");
            }
            await Task.Delay(50);
        }
    }
}
