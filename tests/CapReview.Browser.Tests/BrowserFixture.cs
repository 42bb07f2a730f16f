using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// One app and one headless Debian Chromium for the test class. Chromium is started with no outside lookups so that it
/// talks only to the app on loopback. Set CAPREVIEW_SCREENSHOTS to a folder to keep screenshots.
/// </summary>
public sealed class BrowserFixture : IAsyncLifetime
{
    private IPlaywright? _playwright;
    private string _profile = "";

    public AppHost App { get; } = new();

    public IBrowserContext Browser { get; private set; } = null!;

    public static string ChromiumPath => Environment.GetEnvironmentVariable("CHROMIUM_PATH") ?? "/usr/bin/chromium";

    public async Task InitializeAsync()
    {
        if (!File.Exists(ChromiumPath))
        {
            throw new InvalidOperationException($"Chromium is not at {ChromiumPath}: install Debian's chromium package (see README) or set CHROMIUM_PATH.");
        }
        App.Start();
        _playwright = await Playwright.CreateAsync();
        _profile = Directory.CreateTempSubdirectory("capreview-chromium-").FullName;
        Browser = await _playwright.Chromium.LaunchPersistentContextAsync(_profile, new BrowserTypeLaunchPersistentContextOptions
        {
            ExecutablePath = ChromiumPath,
            Headless = true,
            ViewportSize = new ViewportSize { Width = 1280, Height = 900 },
            Args =
            [
                "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                "--disable-component-update", "--disable-sync", "--host-resolver-rules=MAP * ~NOTFOUND , EXCLUDE 127.0.0.1",
            ],
        });
    }

    public async Task DisposeAsync()
    {
        await Browser.CloseAsync();
        _playwright?.Dispose();
        await App.DisposeAsync();
        try
        {
            Directory.Delete(_profile, recursive: true);
        }
        catch (IOException)
        {
            // Chromium may still be writing its profile as it exits.
        }
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

    /// <summary>A fresh browser context (its own cookies) signed in as the user.</summary>
    public async Task<IPage> SignedInPageAsync(string email, string name, string role, string password = AppHost.Password)
    {
        await App.UserAsync(email, name, role);
        IPage page = await Browser.NewPageAsync();
        await page.Context.ClearCookiesAsync();
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
