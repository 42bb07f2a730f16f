using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// One app and one headless Debian Chromium for the test class. Chromium is started with no outside lookups so that it
/// talks only to the app on loopback. Every page a test opens has a browser context of its own (its own cookies and
/// storage), as two people at two machines would: a sign-in in one test never changes the cookie behind another test's
/// page. Set CAPREVIEW_SCREENSHOTS to a folder to keep screenshots.
/// </summary>
public sealed class BrowserFixture : IAsyncLifetime
{
    private IPlaywright? _playwright;
    private IBrowser? _chromium;

    public AppHost App { get; } = new();

    public static string ChromiumPath => Environment.GetEnvironmentVariable("CHROMIUM_PATH") ?? "/usr/bin/chromium";

    public async Task InitializeAsync()
    {
        if (!File.Exists(ChromiumPath))
        {
            throw new InvalidOperationException($"Chromium is not at {ChromiumPath}: install Debian's chromium package (see README) or set CHROMIUM_PATH.");
        }
        // A figure the server computes (an analysis, a simulation) can take longer than Playwright's default 5 s on a
        // busy two-core machine running several test classes at once; a person would wait for it too.
        Assertions.SetDefaultExpectTimeout(15_000);
        App.Start();
        _playwright = await Playwright.CreateAsync();
        _chromium = await _playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
        {
            ExecutablePath = ChromiumPath,
            Headless = true,
            Args =
            [
                "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                "--disable-component-update", "--disable-sync", "--host-resolver-rules=MAP * ~NOTFOUND , EXCLUDE 127.0.0.1",
            ],
        });
    }

    public async Task DisposeAsync()
    {
        if (_chromium is not null)
        {
            await _chromium.CloseAsync();
        }
        _playwright?.Dispose();
        await App.DisposeAsync();
    }

    /// <summary>
    /// A page in a new browser context: a visitor nobody has signed in yet. Open a second tab of the same visitor with
    /// <c>page.Context.NewPageAsync()</c>; the context stays open when its page closes, so a tab closed and opened again
    /// finds the same cookies and browser storage.
    /// </summary>
    public async Task<IPage> NewVisitorPageAsync()
    {
        var context = await _chromium!.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1280, Height = 900 } });
        return await context.NewPageAsync();
    }

    /// <summary>
    /// The demo scenario in this app's database, and its open and decided cycles. The demo seeds only an installation
    /// without users, so call it before signing anyone in.
    /// </summary>
    public async Task<(int Open, int Decided)> DemoCyclesAsync()
    {
        using var scope = App.Services.CreateScope();
        await scope.ServiceProvider.GetRequiredService<CapReview.Web.Demo.DemoScenario>().EnsureAsync(CancellationToken.None);
        var cycles = await scope.ServiceProvider.GetRequiredService<CapReview.Reviews.Cycles.CycleService>().ListAsync(CancellationToken.None);
        return (cycles.Single(c => c.Status == CapReview.Reviews.Cycles.CycleStatus.Open).Id, cycles.Single(c => c.Status == CapReview.Reviews.Cycles.CycleStatus.Decided).Id);
    }

    /// <summary>A page in a new browser context (its own cookies and storage), signed in as the user.</summary>
    public async Task<IPage> SignedInPageAsync(string email, string name, string role, string password = AppHost.Password)
    {
        await App.UserAsync(email, name, role);
        IPage page = await NewVisitorPageAsync();
        await page.GotoAsync(App.BaseAddress + "signin");
        await page.Locator("#email").FillAsync(email);
        await page.Locator("#password").FillAsync(password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await Assertions.Expect(page.GetByTestId("signed-in-as")).ToHaveTextAsync(name);
        return page;
    }

    public static async Task ScreenshotAsync(IPage page, string name)
    {
        string? folder = Environment.GetEnvironmentVariable("CAPREVIEW_SCREENSHOTS");
        if (string.IsNullOrEmpty(folder))
        {
            return;
        }
        Directory.CreateDirectory(folder);
        await page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(folder, name + ".png"), FullPage = true });
    }

    /// <summary>
    /// Chooses <paramref name="file"/> in a file field and waits for <paramref name="shown"/>. A field chosen in the same
    /// moment the page turns interactive can miss the change (its listener is attached just after), which a person is never
    /// quick enough to do; the file is then chosen again, up to three times.
    /// </summary>
    public static async Task ChooseFileAsync(ILocator field, FilePayload file, ILocator shown)
    {
        for (int attempt = 1; ; attempt++)
        {
            await field.SetInputFilesAsync(file);
            try
            {
                await Assertions.Expect(shown).Not.ToHaveCountAsync(0, new() { Timeout = 10_000 });
                return;
            }
            catch (PlaywrightException) when (attempt < 3)
            {
                // Not read: choose it again.
            }
        }
    }

    /// <summary>A screenshot of one part of the page, when CAPREVIEW_SCREENSHOTS names a folder.</summary>
    public static async Task ScreenshotAsync(ILocator part, string name)
    {
        string? folder = Environment.GetEnvironmentVariable("CAPREVIEW_SCREENSHOTS");
        if (string.IsNullOrEmpty(folder))
        {
            return;
        }
        Directory.CreateDirectory(folder);
        await part.ScreenshotAsync(new LocatorScreenshotOptions { Path = Path.Combine(folder, name + ".png") });
    }
}
