using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using CapReview.Reviews.Cycles;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>An administrator's corrections through the API: roles, a cycle's terms, the audit trail as JSON and as CSV.</summary>
public sealed class AdministrationApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private Task<(HttpClient Client, string UserId)> AdminAsync() => factory.TokenClientAsync("corrections.admin@tarnby.example", RoleNames.Administrator);

    private static StringContent Json(string body) => new(body, Encoding.UTF8, "application/json");

    [Fact]
    public async Task A_role_change_ends_the_person_s_sessions_and_their_token_answers_in_the_new_roles()
    {
        var (admin, _) = await AdminAsync();
        var (person, personId) = await factory.TokenClientAsync("corrections.board@tarnby.example", RoleNames.Reviewer);
        string stampBefore;
        using (var scope = factory.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
            stampBefore = (await users.FindByIdAsync(personId))!.SecurityStamp!;
        }
        using (var refused = await person.GetAsync("/api/v1/users"))
        {
            Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        }

        using var changed = await admin.PutAsync($"/api/v1/users/{personId}/roles", Json("""{ "roles": ["reviewer", "administrator"] }"""));
        Assert.Equal(HttpStatusCode.OK, changed.StatusCode);
        using JsonDocument answer = JsonDocument.Parse(await changed.Content.ReadAsStringAsync());
        Assert.Equal(["administrator", "reviewer"], answer.RootElement.GetProperty("roles").EnumerateArray().Select(r => r.GetString()));

        using (var allowed = await person.GetAsync("/api/v1/users"))
        {
            Assert.Equal(HttpStatusCode.OK, allowed.StatusCode);
        }
        using (var scope = factory.Services.CreateScope())
        {
            var users = scope.ServiceProvider.GetRequiredService<UserManager<CapReviewUser>>();
            Assert.NotEqual(stampBefore, (await users.FindByIdAsync(personId))!.SecurityStamp);
        }

        using JsonDocument trail = JsonDocument.Parse(await admin.GetStringAsync("/api/v1/audit-events?person=" + Uri.EscapeDataString(
            (await factory.TokenClientAsync("corrections.admin@tarnby.example", RoleNames.Administrator)).UserId)));
        var change = trail.RootElement.GetProperty("events").EnumerateArray().First(e => e.GetProperty("action").GetString() == "user.roles-changed");
        Assert.Equal("Account of corrections.board@tarnby.example", change.GetProperty("item").GetString());
        Assert.Equal("""{"roles":["Reviewer"]}""", change.GetProperty("before").GetString());
        Assert.Equal("""{"roles":["Reviewer","Administrator"]}""", change.GetProperty("after").GetString());
    }

    [Fact]
    public async Task Roles_that_are_not_roles_are_refused_by_name()
    {
        var (admin, _) = await AdminAsync();
        var (_, personId) = await factory.TokenClientAsync("corrections.finance@tarnby.example", RoleNames.Finance);
        using var none = await admin.PutAsync($"/api/v1/users/{personId}/roles", Json("""{ "roles": [] }"""));
        Assert.Equal(HttpStatusCode.BadRequest, none.StatusCode);
        Assert.Contains("roles", await none.Content.ReadAsStringAsync());
        using var owner = await admin.PutAsync($"/api/v1/users/{personId}/roles", Json("""{ "roles": ["owner"] }"""));
        Assert.Equal(HttpStatusCode.BadRequest, owner.StatusCode);
    }

    [Fact]
    public async Task A_cycle_correction_with_text_for_the_limit_is_refused_by_name_and_changes_nothing()
    {
        var (admin, _) = await AdminAsync();
        var (cycle, _) = await factory.CycleWithSubmittedProposalAsync("API correction", 0.08, ApiFactory.Draft("Dryer", 5, 10_000, 3_000));
        using var refused = await admin.PutAsync($"/api/v1/cycles/{cycle.Id}/terms",
            Json($$"""{ "capitalLimit": "lots", "opensOn": "2027-01-01", "closesOn": "2027-03-31", "revision": {{cycle.Revision}} }"""));
        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        Assert.Contains("capitalLimit", await refused.Content.ReadAsStringAsync());

        using var stale = await admin.PutAsync($"/api/v1/cycles/{cycle.Id}/terms",
            Json($$"""{ "capitalLimit": 400000, "opensOn": "2027-01-01", "closesOn": "2027-03-31", "revision": {{cycle.Revision + 5}} }"""));
        Assert.Equal(HttpStatusCode.Conflict, stale.StatusCode);
        var stored = (await factory.Services.GetRequiredService<CycleService>().GetAsync(cycle.Id, CancellationToken.None)).Cycle;
        Assert.Equal(500_000m, stored.CapitalLimit);

        await factory.Services.GetRequiredService<CycleService>().MoveAsync(
            CapReview.Reviews.Access.Actor.Of("x", "x", CapReview.Reviews.Access.Role.Administrator), cycle.Id, CycleStatus.InReview, cycle.Revision, CancellationToken.None);
        using var late = await admin.PutAsync($"/api/v1/cycles/{cycle.Id}/terms",
            Json($$"""{ "capitalLimit": 400000, "opensOn": "2027-01-01", "closesOn": "2027-03-31", "revision": {{cycle.Revision + 1}} }"""));
        Assert.Equal(HttpStatusCode.BadRequest, late.StatusCode);
        Assert.Contains("no longer open", await late.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task The_filtered_trail_downloads_as_a_plain_csv_table_with_names()
    {
        var (admin, _) = await AdminAsync();
        var (_, proposal) = await factory.CycleWithSubmittedProposalAsync("API trail", 0.08, ApiFactory.Draft("Trail press", 5, 10_000, 3_000));
        string query = "?proposal=" + Uri.EscapeDataString(proposal.Reference);
        using JsonDocument json = JsonDocument.Parse(await admin.GetStringAsync("/api/v1/audit-events" + query));
        var events = json.RootElement.GetProperty("events").EnumerateArray().ToList();
        Assert.Equal(["proposal.submitted", "proposal.created"], events.Select(e => e.GetProperty("action").GetString()));

        using var csv = await admin.GetAsync("/api/v1/audit-events/csv" + query);
        Assert.Equal(HttpStatusCode.OK, csv.StatusCode);
        Assert.Equal("text/csv", csv.Content.Headers.ContentType!.MediaType);
        string text = Encoding.UTF8.GetString(await csv.Content.ReadAsByteArrayAsync()).TrimStart('\uFEFF');
        string[] lines = text.Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal("Event,When (UTC),Who,What,Item,Proposal,Before,After,Hash,Action", lines[0]);
        Assert.Equal(3, lines.Length);
        Assert.DoesNotContain(lines, l => l.StartsWith('#'));
        // What happened in words for people; the stored action last, for programs.
        Assert.Contains($",cycle-lead,Proposal created,{proposal.Reference} Trail press,{proposal.Reference},", lines[2], StringComparison.Ordinal);
        Assert.EndsWith(",proposal.created", lines[2], StringComparison.Ordinal);

        using var badDay = await admin.GetAsync("/api/v1/audit-events?from=2027-13-01");
        Assert.Equal(HttpStatusCode.BadRequest, badDay.StatusCode);
        using JsonDocument problem = JsonDocument.Parse(await badDay.Content.ReadAsStringAsync());
        Assert.Equal("Give the first day as yyyy-mm-dd.", problem.RootElement.GetProperty("errors").GetProperty("from")[0].GetString());
        using var reversed = await admin.GetAsync("/api/v1/audit-events?from=2027-02-01&to=2027-01-01");
        Assert.Equal(HttpStatusCode.BadRequest, reversed.StatusCode);
        Assert.Contains("\"to\"", await reversed.Content.ReadAsStringAsync());
    }
}
