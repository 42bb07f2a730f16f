using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using CapReview.Web.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The workflow's refusals through the API: each names the field in problem details, and a refused request changes
/// nothing stored. The happy path is the executed walkthrough of docs/api.md (<see cref="DocumentedWalkthrough"/>).
/// </summary>
public sealed class WorkflowApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string LeadEmail = "workflow.lead@tarnby.example";

    private async Task<HttpClient> ClientAsync(string email, string role) => (await factory.TokenClientAsync(email, role)).Client;

    private static async Task<JsonElement> JsonAsync(HttpResponseMessage response) =>
        JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.Clone();

    private static object Model(double saving) => new
    {
        model = new
        {
            horizon = 4,
            elements = new object[]
            {
                new { type = "single", label = "Conveyor", category = "capital", period = 0, amount = -20_000 },
                new { type = "uniform", label = "Labour saved", category = "operating", first = 1, last = 4, amount = saving },
            },
        },
    };

    /// <summary>A draft of the workflow lead submitted to a fresh cycle; the lead's client and the proposal as submitted.</summary>
    private async Task<(HttpClient Lead, int CycleId, JsonElement Proposal)> SubmittedAsync(string cycleName)
    {
        var (lead, leadId) = await factory.TokenClientAsync(LeadEmail, RoleNames.ProjectLead);
        var (cycle, proposal) = await factory.CycleWithSubmittedProposalAsync(cycleName, 0.08, ApiFactory.Draft(cycleName + " conveyor", 4, 20_000, 7_000), leadId);
        return (lead, cycle.Id, await JsonAsync(await lead.GetAsync($"/api/v1/proposals/{proposal.Id}")));
    }

    private async Task<(int Versions, int AuditEvents)> StoredAsync(int proposalId)
    {
        await using var db = await factory.Services.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContextAsync();
        return (await db.ProposalVersions.CountAsync(v => v.ProposalId == proposalId), await db.AuditEvents.CountAsync());
    }

    [Fact]
    public async Task A_change_without_its_revision_or_from_a_stale_one_is_refused_and_changes_nothing()
    {
        var (lead, _, proposal) = await SubmittedAsync("Stale 2027");
        int id = proposal.GetProperty("id").GetInt32();
        using HttpClient board = await BoardReturnsAsync(id);
        var before = await StoredAsync(id);

        using var missing = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/versions", new { reason = "New quote", assumptions = Model(7_500) });
        Assert.Equal(HttpStatusCode.BadRequest, missing.StatusCode);
        Assert.True((await JsonAsync(missing)).GetProperty("errors").TryGetProperty("revision", out _));

        // The revision the proposal had before the board returned it.
        int stale = proposal.GetProperty("revision").GetInt32();
        using var conflict = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/versions", new { revision = stale, reason = "New quote", assumptions = Model(7_500) });
        Assert.Equal(HttpStatusCode.Conflict, conflict.StatusCode);
        Assert.Equal(before, await StoredAsync(id));

        int current = (await JsonAsync(await lead.GetAsync($"/api/v1/proposals/{id}"))).GetProperty("revision").GetInt32();
        JsonElement submitted = (await JsonAsync(await lead.GetAsync($"/api/v1/proposals/{id}/versions/1"))).GetProperty("assumptions");
        using var unchanged = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/versions", new { revision = current, reason = "Nothing new", assumptions = submitted });
        Assert.Equal(HttpStatusCode.BadRequest, unchanged.StatusCode);
        Assert.Contains("these are the assumptions of version 1 already", (await JsonAsync(unchanged)).GetProperty("errors").GetProperty("assumptions")[0].GetString(), StringComparison.Ordinal);

        using var noReason = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/versions", new { revision = current, reason = " ", assumptions = Model(7_500) });
        JsonElement noReasonBody = await JsonAsync(noReason);
        // The field's path stays the machine's key; what a person reads names it in words.
        Assert.Equal("Reason: say why the assumptions changed.", noReasonBody.GetProperty("errors").GetProperty("reason")[0].GetString());
        Assert.Equal("Reason: say why the assumptions changed.", noReasonBody.GetProperty("detail").GetString());
        Assert.Equal(before, await StoredAsync(id));

        // A frozen version is never changed in place.
        using var frozen = await lead.PutAsJsonAsync($"/api/v1/proposals/{id}/versions/1", new { revision = current, assumptions = Model(7_500) });
        Assert.Equal(HttpStatusCode.BadRequest, frozen.StatusCode);
        Assert.Contains("frozen", (await JsonAsync(frozen)).GetProperty("errors").GetProperty("version")[0].GetString(), StringComparison.Ordinal);
        Assert.Equal(before, await StoredAsync(id));
    }

    [Fact]
    public async Task A_lead_withdraws_through_the_api_and_the_workflow_refuses_a_second_withdrawal()
    {
        var (lead, _, proposal) = await SubmittedAsync("Withdrawn 2027");
        int id = proposal.GetProperty("id").GetInt32();
        using var withdrawn = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/withdrawals", new { revision = proposal.GetProperty("revision").GetInt32() });
        Assert.Equal(HttpStatusCode.OK, withdrawn.StatusCode);
        JsonElement after = await JsonAsync(withdrawn);
        Assert.Equal("withdrawn", after.GetProperty("status").GetString());

        using var again = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/withdrawals", new { revision = after.GetProperty("revision").GetInt32() });
        Assert.Equal(HttpStatusCode.BadRequest, again.StatusCode);
        Assert.Contains("A proposal that is withdrawn cannot become withdrawn.", (await JsonAsync(again)).GetProperty("errors").GetProperty("body")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_decision_needs_its_proposal_outcome_and_version_and_a_proposal_of_another_cycle_is_not_found()
    {
        var (_, cycleId, proposal) = await SubmittedAsync("Decisions 2027");
        var (_, otherCycle, _) = await SubmittedAsync("Other decisions 2027");
        int id = proposal.GetProperty("id").GetInt32();
        using HttpClient board = await ClientAsync("workflow.board@tarnby.example", RoleNames.Reviewer);

        using var noOutcome = await board.PostAsJsonAsync($"/api/v1/cycles/{cycleId}/decisions", new { proposalId = id, version = 1 });
        Assert.True((await JsonAsync(noOutcome)).GetProperty("errors").TryGetProperty("outcome", out _));
        using var badOutcome = await board.PostAsJsonAsync($"/api/v1/cycles/{cycleId}/decisions", new { proposalId = id, outcome = "maybe", version = 1 });
        Assert.True((await JsonAsync(badOutcome)).GetProperty("errors").TryGetProperty("outcome", out _));
        using var noVersion = await board.PostAsJsonAsync($"/api/v1/cycles/{cycleId}/decisions", new { proposalId = id, outcome = "approve" });
        Assert.True((await JsonAsync(noVersion)).GetProperty("errors").TryGetProperty("version", out _));
        using var elsewhere = await board.PostAsJsonAsync($"/api/v1/cycles/{otherCycle}/decisions", new { proposalId = id, outcome = "approve", version = 1 });
        Assert.Equal(HttpStatusCode.NotFound, elsewhere.StatusCode);

        using var decisions = await board.GetAsync($"/api/v1/cycles/{cycleId}/decisions");
        Assert.Equal(0, (await JsonAsync(decisions)).GetArrayLength());
        Assert.Equal(ProposalStatus.Submitted, (await factory.Services.GetRequiredService<ProposalService>()
            .GetAsync(CapReview.Reviews.Access.Actor.Of("x", "x", CapReview.Reviews.Access.Role.Reviewer), id, CancellationToken.None)).Status);
    }

    [Fact]
    public async Task The_lead_and_the_board_discuss_a_proposal_and_finance_cannot_join_before_it_is_decided()
    {
        var (lead, _, proposal) = await SubmittedAsync("Discussed 2027");
        int id = proposal.GetProperty("id").GetInt32();
        using HttpClient board = await ClientAsync("workflow.board@tarnby.example", RoleNames.Reviewer);
        using var asked = await board.PostAsJsonAsync($"/api/v1/proposals/{id}/comments", new { text = "Which shifts does the saving assume?" });
        Assert.Equal(HttpStatusCode.Created, asked.StatusCode);
        using var answered = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/comments", new { text = "Two shifts, five days." });
        Assert.Equal(HttpStatusCode.Created, answered.StatusCode);

        JsonElement thread = await JsonAsync(await lead.GetAsync($"/api/v1/proposals/{id}/comments"));
        Assert.Equal(["Which shifts does the saving assume?", "Two shifts, five days."], thread.EnumerateArray().Select(c => c.GetProperty("text").GetString()));
        Assert.All(thread.EnumerateArray(), c => Assert.Equal(1, c.GetProperty("version").GetInt32()));

        using HttpClient finance = await ClientAsync("workflow.finance@tarnby.example", RoleNames.Finance);
        Assert.Equal(HttpStatusCode.NotFound, (await finance.GetAsync($"/api/v1/proposals/{id}/comments")).StatusCode);
        using var empty = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/comments", new { text = "" });
        Assert.Equal(HttpStatusCode.BadRequest, empty.StatusCode);
    }

    [Fact]
    public async Task An_administrator_moves_a_cycle_into_review_with_its_revision_and_a_stale_one_is_a_conflict_that_changes_nothing()
    {
        var (_, cycleId, _) = await SubmittedAsync("Moved 2027");
        using HttpClient admin = await ClientAsync("workflow.admin@tarnby.example", RoleNames.Administrator);
        JsonElement cycle = await JsonAsync(await admin.GetAsync($"/api/v1/cycles/{cycleId}"));
        int revision = cycle.GetProperty("revision").GetInt32();

        using var stale = await admin.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/status", new { status = "inReview", revision = revision - 1 });
        Assert.Equal(HttpStatusCode.Conflict, stale.StatusCode);
        Assert.Equal("Open", (await JsonAsync(await admin.GetAsync($"/api/v1/cycles/{cycleId}"))).GetProperty("status").GetString());

        using var moved = await admin.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/status", new { status = "inReview", revision });
        Assert.Equal(HttpStatusCode.OK, moved.StatusCode);
        Assert.Equal("InReview", (await JsonAsync(moved)).GetProperty("status").GetString());

        // Only the sign-offs decide a cycle, and only a decided cycle closes.
        using var early = await admin.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/status", new { status = "closed", revision = revision + 1 });
        Assert.Equal(HttpStatusCode.BadRequest, early.StatusCode);
        using var decided = await admin.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/status", new { status = "decided", revision = revision + 1 });
        Assert.Equal("A cycle is decided by its board sign-offs.", (await JsonAsync(decided)).GetProperty("errors").GetProperty("body")[0].GetString());
        Assert.Equal("InReview", (await JsonAsync(await admin.GetAsync($"/api/v1/cycles/{cycleId}"))).GetProperty("status").GetString());
    }

    [Fact]
    public async Task The_board_sets_a_cycles_portfolio_rules_through_the_api()
    {
        var (_, cycleId, first) = await SubmittedAsync("Rules 2027");
        var (lead, leadId) = await factory.TokenClientAsync(LeadEmail, RoleNames.ProjectLead);
        var services = factory.Services.GetRequiredService<ProposalService>();
        var leadActor = CapReview.Reviews.Access.Actor.Of(leadId, "Lead", CapReview.Reviews.Access.Role.ProjectLead);
        var second = await services.CreateDraftAsync(leadActor, ApiFactory.Draft("Rules 2027 robot", 4, 30_000, 9_000), CancellationToken.None);
        await services.SubmitAsync(leadActor, second.Id, cycleId, second.Revision, CancellationToken.None);
        using HttpClient board = await ClientAsync("workflow.board@tarnby.example", RoleNames.Reviewer);
        int a = first.GetProperty("id").GetInt32();

        using var group = await board.PostAsJsonAsync($"/api/v1/cycles/{cycleId}/groups", new { name = "Line 3 handling", mandatory = true, proposalIds = new[] { a, second.Id } });
        Assert.Equal(HttpStatusCode.OK, group.StatusCode);
        JsonElement rules = await JsonAsync(group);
        Assert.Equal("Line 3 handling", rules.GetProperty("groups")[0].GetProperty("name").GetString());
        Assert.True(rules.GetProperty("groups")[0].GetProperty("mandatory").GetBoolean());

        using var circular = await board.PostAsJsonAsync($"/api/v1/cycles/{cycleId}/contingencies", new { dependentProposalId = a, prerequisiteProposalId = second.Id });
        Assert.Equal(HttpStatusCode.BadRequest, circular.StatusCode);
        Assert.True((await JsonAsync(circular)).GetProperty("errors").TryGetProperty("prerequisite", out _));

        using var plan = await board.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/plan", new { studyPeriodYears = 4, laterYearLimits = new[] { 100_000m }, objective = "annualWorth", revision = rules.GetProperty("revision").GetInt32() });
        Assert.Equal(HttpStatusCode.OK, plan.StatusCode);
        JsonElement planned = await JsonAsync(plan);
        Assert.Equal(4, planned.GetProperty("studyPeriodYears").GetInt32());
        Assert.Equal("annualWorth", planned.GetProperty("objective").GetString());

        Assert.Equal(HttpStatusCode.Forbidden, (await lead.GetAsync($"/api/v1/cycles/{cycleId}/portfolio-rules")).StatusCode);
        using var removed = await board.DeleteAsync($"/api/v1/cycles/{cycleId}/groups/{rules.GetProperty("groups")[0].GetProperty("id").GetInt32()}");
        Assert.Equal(0, (await JsonAsync(removed)).GetProperty("groups").GetArrayLength());
    }

    [Fact]
    public async Task Refusals_of_a_cycle_a_submission_and_a_comment_name_the_field_sent_and_change_nothing()
    {
        var (lead, cycleId, proposal) = await SubmittedAsync("Fields 2027");
        using HttpClient admin = await ClientAsync("workflow.admin@tarnby.example", RoleNames.Administrator);
        JsonElement cycle = await JsonAsync(await admin.GetAsync($"/api/v1/cycles/{cycleId}"));
        int marr = cycle.GetProperty("marrPolicyVersionId").GetInt32();
        await using (var db = await factory.Services.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContextAsync())
        {
            int cycles = await db.BudgetCycles.CountAsync();
            foreach (var (field, body) in new (string, object)[]
            {
                ("name", new { name = " ", capitalLimit = 1000, marrPolicyVersionId = marr, opensOn = "2028-01-01", closesOn = "2028-03-01" }),
                ("capitalLimit", new { name = "Fields bad limit", capitalLimit = 0, marrPolicyVersionId = marr, opensOn = "2028-01-01", closesOn = "2028-03-01" }),
                ("closesOn", new { name = "Fields bad dates", capitalLimit = 1000, marrPolicyVersionId = marr, opensOn = "2028-03-01", closesOn = "2028-01-01" }),
                ("requiredSignOffs", new { name = "Fields no sign-offs", capitalLimit = 1000, marrPolicyVersionId = marr, opensOn = "2028-01-01", closesOn = "2028-03-01", requiredSignOffs = 0 }),
            })
            {
                using var refused = await admin.PostAsJsonAsync("/api/v1/cycles", body);
                Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
                Assert.True((await JsonAsync(refused)).GetProperty("errors").TryGetProperty(field, out _), field);
            }
            Assert.Equal(cycles, await db.BudgetCycles.CountAsync());
        }

        int id = proposal.GetProperty("id").GetInt32();
        var before = await StoredAsync(id);
        using var tooLong = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/comments", new { text = new string('a', 2001) });
        Assert.Equal(HttpStatusCode.BadRequest, tooLong.StatusCode);
        Assert.True((await JsonAsync(tooLong)).GetProperty("errors").TryGetProperty("text", out _));
        using var blank = await lead.PostAsJsonAsync($"/api/v1/proposals/{id}/comments", new { text = "  " });
        Assert.True((await JsonAsync(blank)).GetProperty("errors").TryGetProperty("text", out _));
        Assert.Equal(before, await StoredAsync(id));

        // A cycle in review takes no new submissions: the refusal names the cycle sent.
        using var moved = await admin.PutAsJsonAsync($"/api/v1/cycles/{cycleId}/status", new { status = "inReview", revision = cycle.GetProperty("revision").GetInt32() });
        Assert.Equal(HttpStatusCode.OK, moved.StatusCode);
        var (_, leadId) = await factory.TokenClientAsync(LeadEmail, RoleNames.ProjectLead);
        var draft = await factory.Services.GetRequiredService<ProposalService>().CreateDraftAsync(
            CapReview.Reviews.Access.Actor.Of(leadId, "Lead", CapReview.Reviews.Access.Role.ProjectLead), ApiFactory.Draft("Fields 2027 late", 4, 20_000, 7_000), CancellationToken.None);
        using var late = await lead.PostAsJsonAsync($"/api/v1/proposals/{draft.Id}/submissions", new { cycleId, revision = draft.Revision });
        Assert.Equal(HttpStatusCode.BadRequest, late.StatusCode);
        Assert.True((await JsonAsync(late)).GetProperty("errors").TryGetProperty("cycleId", out _));
        Assert.Equal("draft", (await JsonAsync(await lead.GetAsync($"/api/v1/proposals/{draft.Id}"))).GetProperty("status").GetString());
    }

    [Fact]
    public async Task The_packet_job_of_a_cycle_that_does_not_exist_is_not_found_as_a_cycle_not_as_an_undecided_one()
    {
        var (_, cycleId, _) = await SubmittedAsync("Undecided packets 2027");
        using HttpClient board = await ClientAsync("workflow.board@tarnby.example", RoleNames.Reviewer);
        using var missing = await board.GetAsync("/api/v1/cycles/987654/packet-job");
        Assert.Equal(HttpStatusCode.NotFound, missing.StatusCode);
        Assert.Equal("There is no such budget cycle.", (await JsonAsync(missing)).GetProperty("detail").GetString());
        using var undecided = await board.GetAsync($"/api/v1/cycles/{cycleId}/packet-job");
        Assert.Equal(HttpStatusCode.NotFound, undecided.StatusCode);
        Assert.Contains("not decided", (await JsonAsync(undecided)).GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_body_over_the_limit_sent_without_its_length_is_refused_as_too_large_and_changes_nothing()
    {
        var (lead, _, proposal) = await SubmittedAsync("Chunked 2027");
        int id = proposal.GetProperty("id").GetInt32();
        var before = await StoredAsync(id);
        // A valid comment padded with spaces past 1,000,000 bytes, streamed so that no Content-Length is sent.
        byte[] json = System.Text.Encoding.UTF8.GetBytes("{\"text\": \"Hello\"" + new string(' ', 1_100_000) + "}");
        using var content = new StreamContent(new MemoryStream(json));
        content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json");
        content.Headers.ContentLength = null;
        using var request = new HttpRequestMessage(HttpMethod.Post, $"/api/v1/proposals/{id}/comments") { Content = content };
        request.Headers.TransferEncodingChunked = true;
        using var response = await lead.SendAsync(request);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("larger than", (await JsonAsync(response)).GetProperty("errors").GetProperty("body")[0].GetString(), StringComparison.Ordinal);
        Assert.Equal(before, await StoredAsync(id));
    }

    /// <summary>A board member returns the proposal for changes through the API.</summary>
    private async Task<HttpClient> BoardReturnsAsync(int proposalId)
    {
        HttpClient board = await ClientAsync("workflow.board@tarnby.example", RoleNames.Reviewer);
        var proposal = await JsonAsync(await board.GetAsync($"/api/v1/proposals/{proposalId}"));
        using var returned = await board.PostAsJsonAsync($"/api/v1/cycles/{proposal.GetProperty("cycleId").GetInt32()}/decisions",
            new { proposalId, outcome = "returnForChanges", conditions = "Add the maintenance contract", version = 1 });
        Assert.Equal(HttpStatusCode.Created, returned.StatusCode);
        return board;
    }
}
