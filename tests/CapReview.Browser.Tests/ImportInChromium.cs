using System.Text;
using CapReview.Web.Identity;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>A lead imports a model from a spreadsheet file: a bad file is listed cell by cell and changes nothing; a good one is previewed, confirmed and saved.</summary>
public sealed class ImportInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task A_bad_file_changes_nothing_and_a_good_one_is_previewed_then_applied()
    {
        IPage page = await browser.SignedInPageAsync("imports.lead@example.test", "Ines Porter", RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "proposals/new");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await page.Locator("#title").FillAsync("Compressor heat recovery");
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(1);

        var problems = page.GetByTestId("import-problems").Locator("tbody tr");
        await BrowserFixture.ChooseFileAsync(page.Locator("#import-file"), new FilePayload
        {
            Name = "bad.csv",
            MimeType = "text/csv",
            Buffer = Encoding.UTF8.GetBytes("period,Heat sold [revenue],Pumps\n0,-52000,\n1,9000,x\n1,9000,-300\n"),
        }, problems);
        await Assertions.Expect(problems).ToHaveCountAsync(2);
        await Assertions.Expect(problems.Nth(0)).ToContainTextAsync("3C · Pumps“x” is not a number");
        await Assertions.Expect(problems.Nth(1)).ToContainTextAsync("Period 1 is already on row 3");
        await Assertions.Expect(page.GetByTestId("import-replace")).ToHaveCountAsync(0);
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(1);
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=import-heading]"), "import-problems");

        await page.Locator("#import-file").SetInputFilesAsync(new FilePayload
        {
            Name = "heat-recovery.csv",
            MimeType = "text/csv",
            Buffer = Encoding.UTF8.GetBytes("period,Heat exchanger [capital],Heat sold [revenue],Pumps\n0,-52000,,\n1,,9000,-300\n2,,9000,-300\n3,,9000,-300\n4,,9500,-300\n"),
        });
        await Assertions.Expect(page.GetByTestId("import-elements").Locator("tbody tr")).ToHaveCountAsync(4);
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=import-heading]"), "import-preview");
        await page.GetByTestId("import-replace").ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Imported 4 elements. Save the draft to keep them.");
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(4);
        await Assertions.Expect(page.Locator("#horizon")).ToHaveValueAsync("4");

        await page.GetByRole(AriaRole.Button, new() { Name = "Save draft" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("editor-message")).ToHaveTextAsync("Saved.");
        await page.ReloadAsync();
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(4);
    }

    [Fact]
    public async Task A_semicolon_file_with_decimal_commas_is_previewed_number_by_number_and_an_open_mark_waits_for_a_choice()
    {
        IPage page = await browser.SignedInPageAsync("imports.comma@example.test", "Ines Porter", RoleNames.ProjectLead);
        await page.GotoAsync(browser.App.BaseAddress + "proposals/new");
        await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });

        await page.Locator("#import-file").SetInputFilesAsync(new FilePayload
        {
            Name = "press.csv",
            MimeType = "text/csv",
            Buffer = Encoding.UTF8.GetBytes("type;label;category;amount;period;first;last\nsingle;Press;capital;-480000,50;0;;\nuniform;Energy saved;operating;61000,25;;1;8\n"),
        });
        await Assertions.Expect(page.GetByTestId("import-format")).ToContainTextAsync("Fields separated by semicolons; numbers read with a decimal comma");
        var first = page.GetByTestId("import-numbers").Locator("tbody tr").Nth(0);
        await Assertions.Expect(first).ToContainTextAsync("-480000,50");
        await Assertions.Expect(first).ToContainTextAsync("\u2212480,000.50");
        await Assertions.Expect(page.GetByTestId("import-replace")).ToBeEnabledAsync();
        await BrowserFixture.ScreenshotAsync(page.Locator("section[aria-labelledby=import-heading]"), "import-decimal-comma");

        await page.Locator("#import-file").SetInputFilesAsync(new FilePayload
        {
            Name = "open.csv",
            MimeType = "text/csv",
            Buffer = Encoding.UTF8.GetBytes("type;label;category;amount;period\nsingle;Press;capital;-1.250;0\n"),
        });
        await Assertions.Expect(page.GetByTestId("import-ambiguous")).ToContainTextAsync("row 2: -1.250");
        await Assertions.Expect(page.GetByTestId("import-replace")).ToBeDisabledAsync();
        await page.GetByTestId("import-decimal").SelectOptionAsync("Comma");
        await Assertions.Expect(page.GetByTestId("import-ambiguous")).ToHaveCountAsync(0);
        await Assertions.Expect(page.GetByTestId("import-numbers").Locator("tbody tr").Nth(0)).ToContainTextAsync("\u22121,250");
        await page.GetByTestId("import-replace").ClickAsync();
        await Assertions.Expect(page.GetByTestId("element-row")).ToHaveCountAsync(1);
    }
}
