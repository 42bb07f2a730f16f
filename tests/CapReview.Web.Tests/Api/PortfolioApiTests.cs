using System.Net;
using System.Text.Json;
using CapReview.Engine.Comparison;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The portfolio and a version's analyses over the API, on invented ten-year proposals at 10 % whose worths are
/// checked against Microsoft.VisualBasic.Financial (PV, Pmt, IRR) and by hand.
/// </summary>
public sealed class PortfolioApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static readonly CancellationToken None = CancellationToken.None;
    private static readonly Actor Board = Actor.Of("api-board", "API Board", Role.Reviewer);

    private static double PresentWorth(double cost, double saving, double rate = 0.10) => -cost - Financial.PV(rate, 10, saving);

    /// <summary>A board member's token: the cycles here are open, and finance sees a cycle's portfolio only once it is decided.</summary>
    private async Task<HttpClient> BoardAsync() => (await factory.TokenClientAsync("portfolio.board@tarnby.example", RoleNames.Reviewer)).Client;

    /// <summary>A cycle at 10 % with a limit of 500,000 and the proposals given (cost, yearly saving), submitted in order.</summary>
    private async Task<(BudgetCycle Cycle, List<ProposalView> Proposals)> CycleAsync(string name, params (string Title, double Cost, double Saving)[] drafts)
    {
        var (cycle, first) = await factory.CycleWithSubmittedProposalAsync(name, 0.10, ApiFactory.Draft(drafts[0].Title, 10, drafts[0].Cost, drafts[0].Saving), name + "-lead");
        var lead = Actor.Of(name + "-lead", "Lead", Role.ProjectLead);
        var service = factory.Services.GetRequiredService<ProposalService>();
        var all = new List<ProposalView> { first };
        foreach (var (title, cost, saving) in drafts.Skip(1))
        {
            var draft = await service.CreateDraftAsync(lead, ApiFactory.Draft(title, 10, cost, saving), None);
            all.Add(await service.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, None));
        }
        return (cycle, all);
    }

    [Fact]
    public async Task The_portfolio_funds_the_best_set_beside_the_greedy_fill_and_says_the_difference()
    {
        // By hand: the greedy fill takes A (300,000, the best annual worth) and then nothing else fits in 500,000;
        // B and C together (500,000) are worth more.
        var (cycle, p) = await CycleAsync("Portfolio API 2027", ("Hall crane", 300_000, 58_600), ("Kiln burners", 250_000, 49_700), ("Dust extraction", 250_000, 48_800));
        string a = p[0].Reference, b = p[1].Reference, c = p[2].Reference;
        using HttpClient board = await BoardAsync();
        using JsonDocument answer = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/cycles/{cycle.Id}/portfolio"));
        JsonElement root = answer.RootElement;

        Assert.Equal("presentWorth", root.GetProperty("objective").GetString());
        Assert.Equal(500_000, root.GetProperty("capitalLimit").GetDouble());
        JsonElement optimal = root.GetProperty("optimal");
        Assert.Equal(new[] { b, c }.Order(StringComparer.Ordinal), optimal.GetProperty("chosen").EnumerateArray().Select(x => x.GetString()));
        Assert.Equal(PresentWorth(250_000, 49_700) + PresentWorth(250_000, 48_800), optimal.GetProperty("totalWorth").GetDouble(), 6);
        Assert.Equal(500_000, optimal.GetProperty("totalCost").GetDouble(), 6);
        Assert.True(optimal.GetProperty("provenOptimal").GetBoolean());
        JsonElement greedy = root.GetProperty("greedy");
        Assert.Equal([a], greedy.GetProperty("chosen").EnumerateArray().Select(x => x.GetString()));
        Assert.Equal(PresentWorth(300_000, 58_600), greedy.GetProperty("totalWorth").GetDouble(), 6);
        Assert.Equal(JsonValueKind.Null, greedy.GetProperty("upperBound").ValueKind);

        JsonElement difference = root.GetProperty("difference");
        Assert.Equal(PresentWorth(250_000, 49_700) + PresentWorth(250_000, 48_800) - PresentWorth(300_000, 58_600), difference.GetProperty("worth").GetDouble(), 6);
        Assert.Equal(200_000, difference.GetProperty("firstCost").GetDouble(), 6);
        Assert.Equal(new[] { b, c }.Order(StringComparer.Ordinal), difference.GetProperty("onlyOptimal").EnumerateArray().Select(x => x.GetString()));
        Assert.Equal([a], difference.GetProperty("onlyGreedy").EnumerateArray().Select(x => x.GetString()));

        var candidates = root.GetProperty("candidates").EnumerateArray().ToList();
        Assert.Equal([a, b, c], candidates.Select(x => x.GetProperty("reference").GetString()));
        Assert.Equal([1, 2, 3], candidates.Select(x => x.GetProperty("rank").GetInt32()));
        Assert.Equal([false, true, true], candidates.Select(x => x.GetProperty("inOptimal").GetBoolean()));

        // The frontier runs from nothing funded to every proposal, and at 500,000 reaches the optimal set.
        var frontier = root.GetProperty("frontier").EnumerateArray().ToList();
        Assert.Equal(0, frontier[0].GetProperty("totalWorth").GetDouble());
        Assert.Equal(PresentWorth(300_000, 58_600) + PresentWorth(250_000, 49_700) + PresentWorth(250_000, 48_800), frontier[^1].GetProperty("totalWorth").GetDouble(), 6);
        Assert.Equal(optimal.GetProperty("totalWorth").GetDouble(), frontier.Single(f => f.GetProperty("capitalLimit").GetDouble() == 500_000).GetProperty("totalWorth").GetDouble(), 6);
    }

    [Fact]
    public async Task The_portfolio_answers_the_pages_what_ifs_and_refuses_what_it_cannot_read()
    {
        var (cycle, p) = await CycleAsync("Portfolio what-if 2027", ("Hall crane", 300_000, 58_600), ("Kiln burners", 250_000, 49_700), ("Dust extraction", 250_000, 48_800));
        using HttpClient board = await BoardAsync();

        // 300,000 funds only one: A is worth more than B.
        using (JsonDocument narrow = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/cycles/{cycle.Id}/portfolio?limit=300000")))
        {
            Assert.Equal([p[0].Reference], narrow.RootElement.GetProperty("optimal").GetProperty("chosen").EnumerateArray().Select(x => x.GetString()));
            Assert.Equal(0, narrow.RootElement.GetProperty("difference").GetProperty("worth").GetDouble(), 6);
        }
        // Annual worth at a MARR raised by 2 points: each worth is Pmt at 12 % of the present worth at 12 %.
        using (JsonDocument annual = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/cycles/{cycle.Id}/portfolio?objective=annualWorth&shift=2")))
        {
            JsonElement root = annual.RootElement;
            Assert.Equal("annualWorth", root.GetProperty("objective").GetString());
            Assert.Equal(0.02, root.GetProperty("marrShift").GetDouble(), 12);
            double expected = Financial.Pmt(0.12, 10, -PresentWorth(250_000, 49_700, 0.12)) + Financial.Pmt(0.12, 10, -PresentWorth(250_000, 48_800, 0.12));
            Assert.Equal(expected, root.GetProperty("optimal").GetProperty("totalWorth").GetDouble(), 6);
        }

        using var badObjective = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/portfolio?objective=most");
        Assert.Equal(HttpStatusCode.BadRequest, badObjective.StatusCode);
        Assert.Contains("\"objective\"", await badObjective.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        using var badLimit = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/portfolio?limit=-5");
        Assert.Equal(HttpStatusCode.BadRequest, badLimit.StatusCode);
        using var missing = await board.GetAsync("/api/v1/cycles/99999/portfolio");
        Assert.Equal(HttpStatusCode.NotFound, missing.StatusCode);
        Assert.Equal("application/problem+json", missing.Content.Headers.ContentType?.MediaType);
        using HttpClient lead = await factory.CreateAuthenticatedClientAsync();
        using var refused = await lead.GetAsync($"/api/v1/cycles/{cycle.Id}/portfolio");
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
    }

    [Fact]
    public async Task A_versions_incremental_analysis_is_its_groups_step_by_step()
    {
        var (cycle, p) = await CycleAsync("Incremental API 2027", ("Boiler, small", 200_000, 40_000), ("Boiler, large", 260_000, 50_000), ("Roof lights", 50_000, 9_000));
        await factory.Services.GetRequiredService<PortfolioRulesService>().SaveGroupAsync(Board, cycle.Id, new GroupDraft("Boiler", true, [p[0].Id, p[1].Id]), None);
        var (boardClient, _) = await factory.TokenClientAsync("incremental.board@tarnby.example", RoleNames.Reviewer);
        using (boardClient)
        {
            using JsonDocument answer = JsonDocument.Parse(await boardClient.GetStringAsync($"/api/v1/proposals/{p[0].Id}/versions/1/incremental"));
            JsonElement root = answer.RootElement;
            Assert.Equal("Boiler", root.GetProperty("group").GetString());
            Assert.True(root.GetProperty("mandatory").GetBoolean());
            Assert.Equal(0.10, root.GetProperty("marr").GetDouble(), 12);
            // The larger boiler's extra 60,000 buys 10,000 a year: ΔPW and the incremental rate from Financial.PV and IRR.
            JsonElement last = root.GetProperty("steps").EnumerateArray().Last();
            Assert.Equal(p[0].Reference, last.GetProperty("defender").GetString());
            Assert.Equal(p[1].Reference, last.GetProperty("challenger").GetString());
            Assert.Equal(60_000, last.GetProperty("extraFirstCost").GetDouble(), 6);
            Assert.Equal(PresentWorth(60_000, 10_000), last.GetProperty("incrementalPresentWorth").GetDouble(), 6);
            double[] increment = [-60_000, .. Enumerable.Repeat(10_000.0, 10)];
            Assert.Equal(Financial.IRR(ref increment), last.GetProperty("incrementalRateOfReturn").GetDouble(), 9);
            Assert.True(last.GetProperty("challengerWins").GetBoolean());
            Assert.Equal(p[1].Reference, root.GetProperty("bestByIncrementalAnalysis").GetString());
            Assert.Equal(p[1].Reference, root.GetProperty("bestByAnnualWorth").GetString());
            Assert.Equal(PresentWorth(260_000, 50_000), root.GetProperty("presentWorths").GetProperty(p[1].Reference).GetDouble(), 6);
            Assert.Equal("each alternative renewed like for like over the least common multiple of the lives (10 periods)", root.GetProperty("basis").GetString());

            // Not in a group: 404; a version that does not exist: 404; both with problem details.
            using var alone = await boardClient.GetAsync($"/api/v1/proposals/{p[2].Id}/versions/1/incremental");
            Assert.Equal(HttpStatusCode.NotFound, alone.StatusCode);
            Assert.Contains("no exclusive group", await alone.Content.ReadAsStringAsync(), StringComparison.Ordinal);
            using var noVersion = await boardClient.GetAsync($"/api/v1/proposals/{p[0].Id}/versions/7/incremental");
            Assert.Equal(HttpStatusCode.NotFound, noVersion.StatusCode);
        }
    }

    [Fact]
    public async Task Keep_or_replace_answers_for_a_replacement_and_says_why_not_for_others()
    {
        var estimates = new ReplacementEstimates(60_000,
            [new ServiceYear(50_000, 15_000), new ServiceYear(42_000, 18_000)],
            [new ServiceYear(140_000, 5_000), new ServiceYear(110_000, 7_000), new ServiceYear(85_000, 10_000)]);
        var draft = ApiFactory.Draft("Press 4 replacement", 10, 180_000, 30_000, category: ProposalCategory.Replacement);
        draft = draft with { Assumptions = draft.Assumptions with { Replacement = estimates } };
        var (cycle, proposal) = await factory.CycleWithSubmittedProposalAsync("Replacement API 2027", 0.10, draft, "replacement-lead");
        var (boardClient, _) = await factory.TokenClientAsync("replacement.board@tarnby.example", RoleNames.Reviewer);
        using (boardClient)
        {
            using JsonDocument answer = JsonDocument.Parse(await boardClient.GetStringAsync($"/api/v1/proposals/{proposal.Id}/versions/1/replacement"));
            JsonElement root = answer.RootElement;
            Assert.Equal(0.10, root.GetProperty("marr").GetDouble(), 12);
            Assert.Equal(180_000, root.GetProperty("challengerFirstCost").GetDouble(), 6);
            // By hand: keeping the defender through year 1 costs the return lost on 60,000 (6,000), its fall in value
            // (10,000) and the year's operating cost (15,000).
            Assert.Equal(31_000, root.GetProperty("defender").GetProperty("marginalCosts")[0].GetDouble(), 6);
            // The challenger kept one year: 180,000 at 10 % less its value of 140,000, plus 5,000.
            Assert.Equal(180_000 * 1.1 - 140_000 + 5_000, root.GetProperty("challenger").GetProperty("annualCosts")[0].GetDouble(), 6);
            // Kept two years: Financial.Pmt of the present cost at 10 %.
            double twoYears = 180_000 - 110_000 / 1.21 + 5_000 / 1.1 + 7_000 / 1.21;
            Assert.Equal(-Financial.Pmt(0.10, 2, twoYears), root.GetProperty("challenger").GetProperty("annualCosts")[1].GetDouble(), 6);
            Assert.False(string.IsNullOrWhiteSpace(root.GetProperty("recommendation").GetString()));
        }

        // A proposal without estimates of the asset it replaces: 400 with the reason.
        var (_, plain) = await factory.CycleWithSubmittedProposalAsync("Replacement API plain 2027", 0.10, ApiFactory.Draft("Conveyor", 10, 80_000, 16_000), "replacement-lead");
        var (board, _) = await factory.TokenClientAsync("replacement.board@tarnby.example", RoleNames.Reviewer);
        using (board)
        {
            using var refused = await board.GetAsync($"/api/v1/proposals/{plain.Id}/versions/1/replacement");
            Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
            Assert.Contains("has no estimates of the asset it replaces", await refused.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        }
    }
}
