using CapReview.Engine.Rates;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>A lead creates and submits a proposal, a board member sees it in the cycle and decides, two board members sign off.</summary>
public sealed class ReviewFlowInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private async Task<int> OpenCycleAsync()
    {
        var admin = Actor.Of("setup", "Setup", Role.Administrator);
        using var scope = browser.App.Services.CreateScope();
        var marr = await scope.ServiceProvider.GetRequiredService<MarrPolicyService>()
            .AddVersionAsync(admin, new NewMarrPolicy(0.10, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Browser test policy"), CancellationToken.None);
        var cycle = await scope.ServiceProvider.GetRequiredService<CycleService>()
            .CreateAsync(admin, new NewBudgetCycle("Browser cycle 2027", 500_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        return cycle.Id;
    }

    [Fact]
    public async Task A_proposal_goes_from_a_leads_draft_to_a_signed_off_decision()
    {
        int cycleId = await OpenCycleAsync();

        IPage lead = await browser.SignedInPageAsync("nils.lead@tarnby.example", "Nils Lead", RoleNames.ProjectLead);
        await lead.GotoAsync(browser.App.BaseAddress + "proposals/new");
        await lead.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await lead.Locator("#title").FillAsync("Paint booth burner retrofit");
        await lead.Locator("#horizon").FillAsync("8");
        await lead.Locator("#el-0-amount").FillAsync("-60000");
        await lead.Locator("#new-element-type").SelectOptionAsync("Uniform");
        await lead.GetByRole(AriaRole.Button, new() { Name = "Add element" }).ClickAsync();
        await lead.Locator("#el-1-label").FillAsync("Gas saved");
        await lead.Locator("#el-1-category").SelectOptionAsync("Revenue");
        await lead.Locator("#el-1-amount").FillAsync("14000");
        await lead.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(lead.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await Assertions.Expect(lead.GetByRole(AriaRole.Heading, new() { Level = 1 })).ToContainTextAsync("Paint booth burner retrofit");

        await lead.Locator("#cycle").SelectOptionAsync(cycleId.ToString(System.Globalization.CultureInfo.InvariantCulture));
        await lead.GetByRole(AriaRole.Button, new() { Name = "Submit", Exact = true }).ClickAsync();
        await Assertions.Expect(lead.GetByTestId("editor-message")).ToContainTextAsync("Version 1 is now frozen");
        await BrowserFixture.ScreenshotAsync(lead, "proposal-submitted");

        IPage board = await browser.SignedInPageAsync("ulla.board@tarnby.example", "Ulla Board", RoleNames.Reviewer);
        await board.GotoAsync(browser.App.BaseAddress + $"cycles/{cycleId}");
        await board.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        ILocator row = board.GetByTestId("cycle-row").Filter(new() { HasText = "Paint booth burner retrofit" });
        await Assertions.Expect(row).ToContainTextAsync("Submitted");
        // PW = −60,000 + 14,000 (P/A, 10%, 8) = 14,689 (Microsoft.VisualBasic.Financial.PV gives 74,689.05 for the series).
        await Assertions.Expect(row).ToContainTextAsync("14,689");
        // No decision is preselected: nothing can be recorded until the member chooses one.
        await Assertions.Expect(row.GetByRole(AriaRole.Combobox)).ToHaveValueAsync("");
        await Assertions.Expect(row.GetByRole(AriaRole.Button, new() { Name = "Record" })).ToBeDisabledAsync();
        await Assertions.Expect(board.GetByTestId("budget-year")).ToContainTextAsync("500,000");
        await row.GetByRole(AriaRole.Combobox).SelectOptionAsync("Approve");
        await row.GetByRole(AriaRole.Textbox).FillAsync("Install during the August shutdown");
        await row.GetByRole(AriaRole.Button, new() { Name = "Record" }).ClickAsync();
        // Recording asks first; "Not yet" records nothing.
        await Assertions.Expect(board.GetByTestId("confirm-decision")).ToContainTextAsync("Record an approval on");
        await board.GetByRole(AriaRole.Button, new() { Name = "Not yet" }).ClickAsync();
        await Assertions.Expect(board.GetByTestId("confirm-decision")).ToHaveCountAsync(0);
        await Assertions.Expect(row).ToContainTextAsync("Submitted");
        await row.GetByRole(AriaRole.Button, new() { Name = "Record" }).ClickAsync();
        await board.GetByRole(AriaRole.Button, new() { Name = "Yes, record" }).ClickAsync();
        await Assertions.Expect(board.GetByTestId("cycle-message")).ToContainTextAsync("recorded");
        await Assertions.Expect(row).ToContainTextAsync("Approved");
        // The approval's 60,000 counts against the cycle's 500,000.
        await Assertions.Expect(board.GetByTestId("budget-year")).ToContainTextAsync("60,000");
        await Assertions.Expect(board.GetByTestId("budget-year")).ToContainTextAsync("440,000");
        await BrowserFixture.ScreenshotAsync(board, "decision-recorded");
        await board.GetByRole(AriaRole.Button, new() { Name = "Sign off the cycle's decisions" }).ClickAsync();
        // A sign-off cannot be taken back, so it asks first; "Not yet" leaves the cycle as it was.
        await Assertions.Expect(board.Locator(".confirm")).ToContainTextAsync("cannot be taken back");
        await board.GetByRole(AriaRole.Button, new() { Name = "Not yet" }).ClickAsync();
        await Assertions.Expect(board.GetByTestId("cycle-status")).ToContainTextAsync("sign-offs 0 of 2");
        await board.GetByRole(AriaRole.Button, new() { Name = "Sign off the cycle's decisions" }).ClickAsync();
        await board.GetByRole(AriaRole.Button, new() { Name = "Yes, sign off" }).ClickAsync();
        await Assertions.Expect(board.GetByTestId("cycle-status")).ToContainTextAsync("sign-offs 1 of 2");
        // A member who has signed the decisions as they stand has no sign-off button left.
        await Assertions.Expect(board.GetByTestId("signed-by-you")).ToBeVisibleAsync();
        await Assertions.Expect(board.GetByRole(AriaRole.Button, new() { Name = "Sign off the cycle's decisions" })).ToHaveCountAsync(0);

        IPage second = await browser.SignedInPageAsync("jon.board@tarnby.example", "Jon Board", RoleNames.Reviewer);
        await second.GotoAsync(browser.App.BaseAddress + $"cycles/{cycleId}");
        await second.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await second.GetByRole(AriaRole.Button, new() { Name = "Sign off the cycle's decisions" }).ClickAsync();
        await Assertions.Expect(second.Locator(".confirm")).ToContainTextAsync("decides the cycle");
        await second.GetByRole(AriaRole.Button, new() { Name = "Yes, sign off" }).ClickAsync();
        await Assertions.Expect(second.GetByTestId("cycle-status")).ToContainTextAsync("Decided");
        await Assertions.Expect(second.GetByTestId("sign-offs")).ToContainTextAsync("Ulla Board");
        await Assertions.Expect(second.GetByTestId("sign-offs")).ToContainTextAsync("Jon Board");
        // The deciding sign-off queues the signed packets (one for the proposal, one for the cycle); the page shows them
        // once the packet worker has made them, without a reload.
        await Assertions.Expect(second.GetByTestId("cycle-message")).ToContainTextAsync("decides the cycle; its signed packets are being made");
        // The worker renders and signs two PDFs and solves the cycle's portfolio: given time on a busy machine.
        // Making the packets runs each proposal's simulation; on two cores shared with the other suites that can take
        // well over 30 s, and this waits for the outcome, not for a speed.
        await Assertions.Expect(second.GetByTestId("packet-job")).ToHaveAttributeAsync("data-status", "done", new() { Timeout = 120_000 });
        await Assertions.Expect(second.GetByTestId("packets").Locator("tbody tr")).ToHaveCountAsync(2, new() { Timeout = 30_000 });
        string href = (await second.GetByTestId("packets").Locator("a").First.GetAttributeAsync("href"))!;
        var download = await second.APIRequest.GetAsync(browser.App.BaseAddress + href);
        Assert.Equal("application/pdf", download.Headers["content-type"]);
        Assert.Equal("%PDF", System.Text.Encoding.ASCII.GetString((await download.BodyAsync())[..4]));
        await BrowserFixture.ScreenshotAsync(second, "cycle-decided");

        // The lead finds the packet of the proposal on its page.
        await lead.ReloadAsync();
        await Assertions.Expect(lead.GetByTestId("packet-link")).ToBeVisibleAsync();
    }
}
