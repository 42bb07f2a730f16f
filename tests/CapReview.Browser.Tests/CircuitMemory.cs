using Microsoft.Playwright;
using Xunit.Abstractions;

namespace CapReview.Browser.Tests;

/// <summary>
/// Not a test but a measurement, run by hand (docs/benchmarks.md):
/// <c>CAPREVIEW_MEASURE_CIRCUITS=50 dotnet test tests/CapReview.Browser.Tests --filter FullyQualifiedName~CircuitMemory --logger "console;verbosity=detailed"</c>.
/// Opens that many idle quick-evaluation pages (each an interactive circuit on the app in this process) and reports
/// the managed memory they hold after a full collection. Without the variable it does nothing.
/// </summary>
public sealed class CircuitMemory(BrowserFixture browser, ITestOutputHelper output) : IClassFixture<BrowserFixture>
{
    [Fact]
    public async Task Memory_per_idle_circuit_is_reported()
    {
        if (!int.TryParse(Environment.GetEnvironmentVariable("CAPREVIEW_MEASURE_CIRCUITS"), out int count) || count < 1)
        {
            return;
        }
        IPage first = await browser.SignedInPageAsync("circuits@example.test", "Circuit Count", CapReview.Web.Identity.RoleNames.ProjectLead);
        await first.GotoAsync(browser.App.BaseAddress + "evaluate");
        await first.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        long before = Settled();
        var pages = new List<IPage>();
        for (int k = 0; k < count; k++)
        {
            IPage page = await first.Context.NewPageAsync();
            await page.GotoAsync(browser.App.BaseAddress + "evaluate");
            await page.Locator("[data-testid=interactive]").WaitForAsync(new() { State = WaitForSelectorState.Attached });
            pages.Add(page);
        }
        await Task.Delay(2000);
        long after = Settled();
        output.WriteLine($"{count} idle circuits: {(after - before) / 1024.0 / 1024.0:F1} MB managed, {(after - before) / 1024.0 / count:F0} KB a circuit");
        foreach (IPage page in pages)
        {
            await page.CloseAsync();
        }
    }

    private static long Settled()
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        return GC.GetTotalMemory(forceFullCollection: true);
    }
}
