using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The board's rules through the API: a decision that breaks one answers problem details naming the rule in words, an
/// override needs its reason, a changed decision supersedes the old one, and the selected portfolio is approved as confirmed.
/// </summary>
public sealed class DecisionRulesApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static async Task<JsonElement> JsonAsync(HttpResponseMessage response) =>
        JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.Clone();

    /// <summary>A second proposal submitted to the same cycle by the factory's cycle lead.</summary>
    private async Task<ProposalView> AlsoSubmittedAsync(int cycleId, string title, double cost, double saving)
    {
        var lead = Actor.Of("cycle-lead", "Cycle Lead", Role.ProjectLead);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var created = await proposals.CreateDraftAsync(lead, ApiFactory.Draft(title, 6, cost, saving), CancellationToken.None);
        return await proposals.SubmitAsync(lead, created.Id, cycleId, created.Revision, CancellationToken.None);
    }

    [Fact]
    public async Task A_decision_beyond_the_limit_is_refused_by_name_recorded_with_an_override_and_its_reason_and_can_be_changed()
    {
        var (cycle, kiln) = await factory.CycleWithSubmittedProposalAsync("Rules API 2027", 0.08, ApiFactory.Draft("Kiln", 6, 400_000, 110_000));
        var dryer = await AlsoSubmittedAsync(cycle.Id, "Dryer", 200_000, 60_000);
        var (board, _) = await factory.TokenClientAsync("rules.board@tarnby.example", RoleNames.Reviewer);

        using var first = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = kiln.Id, outcome = "approve", version = 1 });
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);
        int firstId = (await JsonAsync(first)).GetProperty("id").GetInt32();

        using var refused = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = dryer.Id, outcome = "approve", version = 1 });
        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        string why = (await JsonAsync(refused)).GetProperty("errors").GetProperty("body")[0].GetString()!;
        // 400,000 + 200,000 approved against the cycle's 500,000.
        Assert.Contains("within the capital limit of the cycle's budget year (600,000 approved against a limit of 500,000)", why, StringComparison.Ordinal);

        using var noReason = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = dryer.Id, outcome = "approve", version = 1, @override = true });
        Assert.Equal(HttpStatusCode.BadRequest, noReason.StatusCode);
        Assert.StartsWith("Reason for the override", (await JsonAsync(noReason)).GetProperty("errors").GetProperty("body")[0].GetString(), StringComparison.Ordinal);
        using var none = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/decisions");
        Assert.Equal(1, (await JsonAsync(none)).GetArrayLength());

        using var overridden = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions",
            new { proposalId = dryer.Id, outcome = "approve", version = 1, @override = true, overrideReason = "The old dryer fails its emissions test in May" });
        Assert.Equal(HttpStatusCode.Created, overridden.StatusCode);
        var recorded = await JsonAsync(overridden);
        Assert.Equal("The old dryer fails its emissions test in May", recorded.GetProperty("overrideReason").GetString());
        Assert.Contains("600,000 approved against a limit of 500,000", recorded.GetProperty("overriddenRules").GetString(), StringComparison.Ordinal);

        // The kiln's approval changed to a rejection: a new decision, the old one kept and marked superseded.
        using var changed = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = kiln.Id, outcome = "reject", version = 1 });
        Assert.Equal(HttpStatusCode.Created, changed.StatusCode);
        int changedId = (await JsonAsync(changed)).GetProperty("id").GetInt32();
        using var all = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/decisions");
        var listed = (await JsonAsync(all)).EnumerateArray().ToList();
        Assert.Equal(3, listed.Count);
        var old = listed.Single(d => d.GetProperty("id").GetInt32() == firstId);
        Assert.Equal(changedId, old.GetProperty("supersededBy").GetInt32());
        Assert.Equal("approve", old.GetProperty("outcome").GetString());
    }

    [Fact]
    public async Task An_approval_changed_to_a_return_supersedes_it_sends_the_proposal_back_and_is_decided_again_once_resubmitted()
    {
        var (cycle, kiln) = await factory.CycleWithSubmittedProposalAsync("Return API 2027", 0.08, ApiFactory.Draft("Kiln burner", 6, 100_000, 30_000));
        var (board, _) = await factory.TokenClientAsync("return.board@tarnby.example", RoleNames.Reviewer);
        using var approved = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = kiln.Id, outcome = "approve", version = 1 });
        int approvalId = (await JsonAsync(approved)).GetProperty("id").GetInt32();

        using var returned = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions",
            new { proposalId = kiln.Id, outcome = "returnForChanges", conditions = "Quote the burner's service contract", version = 1 });
        Assert.Equal(HttpStatusCode.Created, returned.StatusCode);
        var recorded = await JsonAsync(returned);
        Assert.Equal(("returnForChanges", "Quote the burner's service contract"), (recorded.GetProperty("outcome").GetString(), recorded.GetProperty("conditions").GetString()));
        using var listed = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/decisions");
        var old = (await JsonAsync(listed)).EnumerateArray().Single(d => d.GetProperty("id").GetInt32() == approvalId);
        Assert.Equal(recorded.GetProperty("id").GetInt32(), old.GetProperty("supersededBy").GetInt32());
        using var proposal = await board.GetAsync($"/api/v1/proposals/{kiln.Id}");
        Assert.Equal("returnedForChanges", (await JsonAsync(proposal)).GetProperty("status").GetString());

        // Nothing more to decide until its lead resubmits: said in words, nothing recorded.
        using var again = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = kiln.Id, outcome = "approve", version = 1 });
        Assert.Equal(HttpStatusCode.BadRequest, again.StatusCode);
        Assert.Equal($"{kiln.Reference} is returned for changes: the board decides it again once its lead resubmits it.",
            (await JsonAsync(again)).GetProperty("errors").GetProperty("body")[0].GetString());

        var lead = Actor.Of("cycle-lead", "Cycle Lead", Role.ProjectLead);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var current = await proposals.GetAsync(lead, kiln.Id, CancellationToken.None);
        var revised = await proposals.ReviseAsync(lead, kiln.Id, current.Revision, ApiFactory.Draft("Kiln burner", 6, 104_000, 30_000).Assumptions,
            "Service contract quoted", CancellationToken.None);
        await proposals.SubmitAsync(lead, kiln.Id, cycle.Id, revised.Revision, CancellationToken.None);
        using var decided = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = kiln.Id, outcome = "approve", version = 2 });
        Assert.Equal(HttpStatusCode.Created, decided.StatusCode);
        Assert.Equal(2, (await JsonAsync(decided)).GetProperty("version").GetInt32());
    }

    [Fact]
    public async Task The_selected_portfolio_that_breaks_a_rule_beside_an_earlier_approval_is_approved_only_with_an_override_and_its_reason()
    {
        var (cycle, press) = await factory.CycleWithSubmittedProposalAsync("Portfolio override API 2027", 0.08, ApiFactory.Draft("Press", 6, 300_000, 90_000));
        var lathe = await AlsoSubmittedAsync(cycle.Id, "Lathe", 250_000, 55_000);
        var (board, _) = await factory.TokenClientAsync("override.board@tarnby.example", RoleNames.Reviewer);
        using var first = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions", new { proposalId = lathe.Id, outcome = "approve", version = 1 });
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);

        // The selection is the press alone; beside the lathe approved before, 300,000 + 250,000 against 500,000.
        using var refused = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio", new { proposalIds = new[] { press.Id } });
        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        Assert.Contains("(550,000 approved against a limit of 500,000)", (await JsonAsync(refused)).GetProperty("errors").GetProperty("body")[0].GetString(), StringComparison.Ordinal);

        using var overridden = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio",
            new { proposalIds = new[] { press.Id }, @override = true, overrideReason = "The lathe is paid from the maintenance budget" });
        Assert.Equal(HttpStatusCode.Created, overridden.StatusCode);
        var decision = Assert.Single((await JsonAsync(overridden)).EnumerateArray());
        Assert.Equal("The lathe is paid from the maintenance budget", decision.GetProperty("overrideReason").GetString());
        Assert.Contains("550,000 approved against a limit of 500,000", decision.GetProperty("overriddenRules").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_selected_portfolio_is_listed_then_approved_only_as_confirmed()
    {
        var (cycle, press) = await factory.CycleWithSubmittedProposalAsync("Portfolio approval API 2027", 0.08, ApiFactory.Draft("Press", 6, 300_000, 90_000));
        // Too dear beside the press within 500,000, and worth less: the selection leaves it out.
        var lathe = await AlsoSubmittedAsync(cycle.Id, "Lathe", 250_000, 55_000);
        var (board, _) = await factory.TokenClientAsync("portfolio.board@tarnby.example", RoleNames.Reviewer);
        var (finance, _) = await factory.TokenClientAsync("portfolio.finance@tarnby.example", RoleNames.Finance);

        using var plan = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio");
        Assert.Equal(HttpStatusCode.OK, plan.StatusCode);
        var listed = Assert.Single((await JsonAsync(plan)).EnumerateArray());
        Assert.Equal((press.Id, 1, 300_000.0), (listed.GetProperty("proposalId").GetInt32(), listed.GetProperty("version").GetInt32(), listed.GetProperty("firstCost").GetDouble()));

        using var other = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio", new { proposalIds = new[] { lathe.Id } });
        Assert.Equal(HttpStatusCode.Conflict, other.StatusCode);
        using var empty = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio", new { proposalIds = Array.Empty<int>() });
        Assert.Equal(HttpStatusCode.BadRequest, empty.StatusCode);
        Assert.True((await JsonAsync(empty)).GetProperty("errors").TryGetProperty("proposalIds", out _));
        using var notBoard = await finance.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio", new { proposalIds = new[] { press.Id } });
        Assert.Equal(HttpStatusCode.Forbidden, notBoard.StatusCode);

        using var approved = await board.PostAsJsonAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio", new { proposalIds = new[] { press.Id } });
        Assert.Equal(HttpStatusCode.Created, approved.StatusCode);
        var decision = Assert.Single((await JsonAsync(approved)).EnumerateArray());
        Assert.Equal((press.Id, "approve"), (decision.GetProperty("proposalId").GetInt32(), decision.GetProperty("outcome").GetString()));
        using var after = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/decisions/portfolio");
        Assert.Equal(0, (await JsonAsync(after)).GetArrayLength());
    }
}
