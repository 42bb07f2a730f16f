using System.Text.Json;
using CapReview.Web.Demo;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Playwright;

namespace CapReview.Browser.Tests;

/// <summary>
/// Every page, as the role that uses it and with the demo's data, audited by axe-core (the npm package pinned in
/// package-lock.json) for WCAG 2.1 A and AA: no serious or critical violation is allowed.
/// </summary>
public sealed class AccessibilityInChromium(BrowserFixture browser) : IClassFixture<BrowserFixture>
{
    private static readonly JsonSerializerOptions Indented = new() { WriteIndented = true };

    private static readonly Lazy<string> AxeSource = new(() => File.ReadAllText(AxeScript) + "\n;undefined");

    private static string AxeScript
    {
        get
        {
            var folder = new DirectoryInfo(AppContext.BaseDirectory);
            while (folder is not null && !File.Exists(Path.Combine(folder.FullName, "package.json")))
            {
                folder = folder.Parent;
            }
            string path = Path.Combine(folder?.FullName ?? "", "node_modules", "axe-core", "axe.min.js");
            return File.Exists(path) ? path : throw new InvalidOperationException($"axe-core is not at {path}: run npm ci in tests/CapReview.Browser.Tests (the build does it).");
        }
    }

    public static TheoryData<string, string> Pages() => new()
    {
        { "anonymous", "signin" },
        { "anonymous", "denied" },
        { "anonymous", "not-found" },
        { RoleNames.ProjectLead, "" },
        { RoleNames.ProjectLead, "evaluate" },
        { RoleNames.ProjectLead, "proposals" },
        { RoleNames.ProjectLead, "proposals/new" },
        { RoleNames.ProjectLead, "proposals/{draft}" },
        { RoleNames.ProjectLead, "proposals/{replacement}/replacement" },
        { RoleNames.Reviewer, "proposals/{solar}" },
        { RoleNames.Reviewer, "cycles" },
        { RoleNames.Reviewer, "cycles/{open}" },
        { RoleNames.Reviewer, "cycles/{open}/ranking" },
        { RoleNames.Reviewer, "cycles/{open}/portfolio" },
        { RoleNames.Finance, "cycles/{decided}" },
        { RoleNames.ProjectLead, "account" },
        { RoleNames.Administrator, "admin/users" },
        { RoleNames.Administrator, "admin/marr" },
        { RoleNames.Administrator, "admin/cycles" },
        { RoleNames.Administrator, "admin/audit" },
    };

    [Theory]
    [MemberData(nameof(Pages))]
    public async Task The_page_has_no_serious_or_critical_accessibility_violation(string role, string route)
    {
        var refused = new List<string>();
        IPage page = await OpenAsync(role, route, refused);
        try
        {
            // The strict Content-Security-Policy must not have stopped anything the page needs.
            Assert.True(refused.Count == 0, $"/{route} as {role}: {string.Join(" | ", refused)}");
            // Evaluated through the debugging protocol, which the page's Content-Security-Policy does not govern
            // (a script tag would be refused, as it should be).
            await page.EvaluateAsync(AxeSource.Value);
            string json = await page.EvaluateAsync<string>("""
                async () => {
                  const r = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] }, resultTypes: ['violations'] });
                  return JSON.stringify(r.violations.filter(v => v.impact === 'serious' || v.impact === 'critical')
                    .map(v => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map(n => n.target.join(' ') + ' :: ' + n.failureSummary) })));
                }
                """);
            var violations = JsonDocument.Parse(json).RootElement;
            Assert.True(violations.GetArrayLength() == 0, $"/{route} as {role}:\n{JsonSerializer.Serialize(violations, Indented)}");
        }
        finally
        {
            await page.CloseAsync();
        }
    }

    /// <summary>At 1280 × 800 and on a phone-sized screen (390 × 844) the page itself never scrolls sideways: wide tables scroll in their own frame.</summary>
    [Theory]
    [MemberData(nameof(Pages))]
    public async Task The_page_fits_a_laptop_and_a_narrow_screen(string role, string route)
    {
        IPage page = await OpenAsync(role, route);
        try
        {
            foreach (var (width, height) in new[] { (1280, 800), (390, 844) })
            {
                await page.SetViewportSizeAsync(width, height);
                // Charts follow a resize of the window a moment later (Plotly's own listener); a busy machine
                // makes that moment longer, so wait for the page to fit before naming what does not.
                try
                {
                    await page.WaitForFunctionAsync("() => document.documentElement.scrollWidth <= document.documentElement.clientWidth + 1", null, new() { Timeout = 5_000 });
                }
                catch (TimeoutException)
                {
                    // Still too wide: the report below names the widest parts.
                }
                string overflow = await page.EvaluateAsync<string>("""
                    () => {
                      const w = document.documentElement.clientWidth;
                      const wide = [...document.querySelectorAll('body *')].filter(e => {
                        const r = e.getBoundingClientRect();
                        return r.right > w + 1 && !e.closest('.table-scroll, .plot-frame, .js-plotly-plot') && getComputedStyle(e).position !== 'fixed';
                      }).slice(0, 5).map(e => e.tagName.toLowerCase() + (e.id ? '#' + e.id : '') + (e.className && typeof e.className === 'string' ? '.' + e.className.split(' ').join('.') : '') + ' ' + Math.round(e.getBoundingClientRect().right));
                      return document.documentElement.scrollWidth > w + 1 ? 'page ' + document.documentElement.scrollWidth + ' > ' + w + ': ' + wide.join(', ') : '';
                    }
                    """);
                Assert.True(overflow.Length == 0, $"/{route} as {role} at {width} px: {overflow}");
            }
        }
        finally
        {
            await page.CloseAsync();
        }
    }

    private async Task<IPage> OpenAsync(string role, string route, List<string>? refused = null)
    {
        var ids = await DemoIdsAsync();
        string path = ids.Aggregate(route, (p, id) => p.Replace("{" + id.Key + "}", id.Value.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal));
        IPage page;
        if (role == "anonymous")
        {
            page = await browser.NewVisitorPageAsync();
        }
        else
        {
            var person = DemoScenario.People.First(p => p.Role == role);
            page = await browser.SignedInPageAsync(person.Email, person.Name, role, DemoScenario.Password);
        }
        if (refused is not null)
        {
            page.Console += (_, message) =>
            {
                if (message.Text.Contains("Content Security Policy", StringComparison.Ordinal))
                {
                    refused.Add(message.Text);
                }
            };
        }
        await page.GotoAsync(browser.App.BaseAddress + path);
        await page.WaitForLoadStateAsync(LoadState.NetworkIdle);
        return page;
    }

    private async Task<Dictionary<string, int>> DemoIdsAsync()
    {
        var (open, decided) = await browser.DemoCyclesAsync();
        using var scope = browser.App.Services.CreateScope();
        var oskar = await scope.ServiceProvider.GetRequiredService<IdentityStore>().FindByEmailAsync("oskar.lind@tarnby.example");
        var own = await scope.ServiceProvider.GetRequiredService<CapReview.Reviews.Proposals.ProposalService>()
            .ListOwnAsync(CapReview.Reviews.Access.Actor.Of(oskar!.Id, "Oskar Lind", CapReview.Reviews.Access.Role.ProjectLead), CancellationToken.None);
        var admin = CapReview.Reviews.Access.Actor.Of("audit", "Audit", CapReview.Reviews.Access.Role.Administrator);
        var inOpen = await scope.ServiceProvider.GetRequiredService<CapReview.Reviews.Proposals.ProposalService>().ListInCycleAsync(admin, open, CancellationToken.None);
        return new()
        {
            ["open"] = open,
            ["decided"] = decided,
            ["draft"] = own.Single(p => p.Title == "Forklift fleet electrification").Id,
            ["replacement"] = own.Where(p => p.Latest.Assumptions.Replacement is not null).Select(p => p.Id).DefaultIfEmpty(own[0].Id).First(),
            ["solar"] = inOpen.First(p => p.Latest.Assumptions.Risk is not null).Id,
        };
    }
}
