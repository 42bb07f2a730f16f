using System.Security.Claims;
using CapReview.Engine.Rates;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Web.Components.Admin;
using CapReview.Web.Tests.Api;
using Microsoft.AspNetCore.Components;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Components;

/// <summary>
/// The administrator forms on the real services: text in a number field is refused at the field in the person's words
/// and nothing is created or changed; a new MARR version starts from the current one's figures.
/// </summary>
public sealed class AdminFormTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static readonly Actor Admin = Actor.Of("form-admin", "Form Admin", Role.Administrator);

    private BunitContext Context()
    {
        var context = new BunitContext();
        context.JSInterop.Mode = JSRuntimeMode.Loose;
        // The app's own services (so the forms save to a real database), not its whole provider: the renderer's are bUnit's.
        context.Services.AddSingleton(factory.Services.GetRequiredService<MarrPolicyService>());
        context.Services.AddSingleton(factory.Services.GetRequiredService<CycleService>());
        context.Services.AddSingleton(factory.Services.GetRequiredService<CapReview.Web.Identity.UserAdministration>());
        context.Services.AddSingleton(factory.Services.GetRequiredService<CapReview.Web.Formatting.DisplayFormat>());
        context.Services.AddSingleton(factory.Services.GetRequiredService<CapReview.Reviews.Interchange.CycleImporter>());
        var auth = context.AddAuthorization();
        auth.SetAuthorized("Form Admin");
        auth.SetRoles(nameof(Role.Administrator));
        auth.SetClaims(new Claim(ClaimTypes.NameIdentifier, Admin.UserId));
        context.SetRendererInfo(new RendererInfo("Server", isInteractive: true));
        return context;
    }

    private static void Click<T>(IRenderedComponent<T> page, string text)
        where T : IComponent =>
        page.FindAll("button").First(b => b.TextContent.Trim() == text).Click();

    [Fact]
    public async Task A_new_marr_version_starts_from_the_current_one_s_premiums_and_rate()
    {
        var marr = factory.Services.GetRequiredService<MarrPolicyService>();
        await marr.AddVersionAsync(Admin, new NewMarrPolicy(0.11, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Prefill source",
            LowRiskPremium: -0.01, StandardRiskPremium: 0.02, HighRiskPremium: 0.05, InflationRate: 0.03), CancellationToken.None);
        using var context = Context();
        var page = context.Render<AdminMarr>();
        page.WaitForAssertion(() => Assert.Equal("5", page.Find("#marr-high").GetAttribute("value")));
        Assert.Equal("11", page.Find("#marr-rate").GetAttribute("value"));
        Assert.Equal("-1", page.Find("#marr-low").GetAttribute("value"));
        Assert.Equal("2", page.Find("#marr-standard").GetAttribute("value"));
        Assert.Equal("3", page.Find("#marr-inflation").GetAttribute("value"));
    }

    [Fact]
    public async Task Text_in_a_marr_number_field_is_refused_at_the_field_and_adds_no_version()
    {
        var marr = factory.Services.GetRequiredService<MarrPolicyService>();
        int before = (await marr.ListAsync(CancellationToken.None)).Count;
        using var context = Context();
        var page = context.Render<AdminMarr>();
        page.WaitForAssertion(() => page.Find("#marr-rate"));
        page.Find("#marr-rate").Change("nine");
        page.Find("#marr-high").Change("3 points");
        page.Find("#marr-reason").Change("Board rate");
        Click(page, "Add version");

        page.WaitForAssertion(() => Assert.Equal("Rate: give a number", page.Find("#marr-rate-error").TextContent));
        Assert.Equal("High-risk premium: give a number", page.Find("#marr-high-error").TextContent);
        Assert.Equal("true", page.Find("#marr-rate").GetAttribute("aria-invalid"));
        Assert.Null(page.Find("#marr-low").GetAttribute("aria-invalid"));
        Assert.DoesNotContain("rate:", page.Markup, StringComparison.Ordinal);
        Assert.Equal(before, (await marr.ListAsync(CancellationToken.None)).Count);
    }

    [Fact]
    public async Task A_premium_the_policy_refuses_is_shown_at_its_field_in_words()
    {
        var marr = factory.Services.GetRequiredService<MarrPolicyService>();
        int before = (await marr.ListAsync(CancellationToken.None)).Count;
        using var context = Context();
        var page = context.Render<AdminMarr>();
        page.WaitForAssertion(() => page.Find("#marr-rate"));
        page.Find("#marr-rate").Change("8");
        page.Find("#marr-low").Change("-49");
        page.Find("#marr-reason").Change("Board rate");
        Click(page, "Add version");

        page.WaitForAssertion(() => Assert.StartsWith("Low-risk premium: with this premium", page.Find("#marr-low-error").TextContent, StringComparison.Ordinal));
        Assert.DoesNotContain("lowRiskPremium", page.Markup, StringComparison.Ordinal);
        Assert.Equal(before, (await marr.ListAsync(CancellationToken.None)).Count);
    }

    [Fact]
    public async Task Text_in_a_cycle_s_capital_limit_is_refused_at_the_field_and_opens_no_cycle()
    {
        await factory.Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(Admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "For cycles"), CancellationToken.None);
        var cycles = factory.Services.GetRequiredService<CycleService>();
        int before = (await cycles.ListAsync(CancellationToken.None)).Count;
        using var context = Context();
        var page = context.Render<AdminCycles>();
        page.WaitForAssertion(() => page.Find("#cycle-limit"));
        page.Find("#cycle-name").Change("Refused plan");
        page.Find("#cycle-limit").Change("a million");
        page.Find("#cycle-signoffs").Change("two");
        Click(page, "Open cycle");

        page.WaitForAssertion(() => Assert.Equal("Capital limit: give a number", page.Find("#cycle-limit-error").TextContent));
        Assert.Equal("Sign-offs needed: give a whole number", page.Find("#cycle-signoffs-error").TextContent);
        Assert.Equal(before, (await cycles.ListAsync(CancellationToken.None)).Count);

        page.Find("#cycle-limit").Change("0");
        page.Find("#cycle-signoffs").Change("2");
        Click(page, "Open cycle");
        page.WaitForAssertion(() => Assert.Equal("Capital limit: the capital limit must be above zero.", page.Find("#cycle-limit-error").TextContent));
        Assert.DoesNotContain("capitalLimit", page.Markup, StringComparison.Ordinal);
        Assert.Equal(before, (await cycles.ListAsync(CancellationToken.None)).Count);
    }

    [Fact]
    public async Task A_correction_with_text_for_the_limit_is_refused_at_the_field_and_changes_nothing()
    {
        var (cycle, _) = await factory.CycleWithSubmittedProposalAsync("Form correction", 0.08, ApiFactory.Draft("Kiln fan", 5, 10_000, 3_000));
        using var context = Context();
        var page = context.Render<AdminCycles>();
        page.WaitForAssertion(() => page.Find($"button[aria-label='Correct the dates and capital limit of Form correction']"));
        page.Find($"button[aria-label='Correct the dates and capital limit of Form correction']").Click();
        page.Find("#correct-limit").Change("half a million");
        Click(page, "Save the correction");

        page.WaitForAssertion(() => Assert.Equal("Capital limit: give a number", page.Find("#correct-limit-error").TextContent));
        var stored = (await factory.Services.GetRequiredService<CycleService>().GetAsync(cycle.Id, CancellationToken.None)).Cycle;
        Assert.Equal(500_000m, stored.CapitalLimit);
        Assert.Equal(cycle.Revision, stored.Revision);

        page.Find("#correct-limit").Change("600000");
        Click(page, "Save the correction");
        page.WaitForAssertion(() => Assert.Contains("Form correction now runs", page.Markup, StringComparison.Ordinal));
        Assert.Equal(600_000m, (await factory.Services.GetRequiredService<CycleService>().GetAsync(cycle.Id, CancellationToken.None)).Cycle.CapitalLimit);
    }

    [Fact]
    public async Task A_person_left_without_a_role_is_refused_at_the_roles_and_keeps_theirs()
    {
        var (_, personId) = await factory.TokenClientAsync("form.roles@tarnby.example", CapReview.Web.Identity.RoleNames.Reviewer);
        using var context = Context();
        var page = context.Render<AdminUsers>();
        page.WaitForAssertion(() => page.Find("button[aria-label='Change the roles of form.roles@tarnby.example']"));
        page.Find("button[aria-label='Change the roles of form.roles@tarnby.example']").Click();
        // Found again after each change: every change draws the boxes anew.
        for (int k = 0; k < page.FindAll("fieldset.roles input[type=checkbox]").Count; k++)
        {
            page.FindAll("fieldset.roles input[type=checkbox]")[k].Change(false);
        }
        Click(page, "Save the roles");

        page.WaitForAssertion(() => Assert.Equal("Roles: choose at least one of the roles.", page.Find("#roles-error").TextContent));
        var person = (await factory.Services.GetRequiredService<CapReview.Web.Identity.UserAdministration>().ListAsync(Admin, CancellationToken.None)).Single(u => u.Id == personId);
        Assert.Equal(["Reviewer"], person.Roles);
    }
}
