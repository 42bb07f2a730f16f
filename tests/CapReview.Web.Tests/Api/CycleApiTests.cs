using System.Net;
using System.Text.Json;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Api;

public sealed class CycleApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private async Task<HttpClient> FinanceClientAsync() => (await factory.TokenClientAsync("api.finance@tarnby.example", RoleNames.Finance)).Client;

    private async Task<HttpClient> BoardClientAsync() => (await factory.TokenClientAsync("api.board@tarnby.example", RoleNames.Reviewer)).Client;

    [Fact]
    public async Task The_board_reads_an_open_cycles_ranking_finance_is_told_to_wait_for_the_decision_and_a_lead_is_refused()
    {
        var (cycle, draft) = await factory.CycleWithSubmittedProposalAsync("API cycle", 0.08, ApiFactory.Draft("Press", 10, 80_000, 16_000, costLabel: "Press"), "api-lead");

        using HttpClient finance = await FinanceClientAsync();
        using JsonDocument cycles = JsonDocument.Parse(await finance.GetStringAsync("/api/v1/cycles"));
        Assert.Contains(cycles.RootElement.EnumerateArray(), c => c.GetProperty("name").GetString() == "API cycle");
        using (var early = await finance.GetAsync($"/api/v1/cycles/{cycle.Id}/ranking"))
        {
            Assert.Equal(HttpStatusCode.Forbidden, early.StatusCode);
            Assert.Equal("Finance sees the ranking and portfolio of the cycle API cycle once the board has decided it; it is still open.",
                JsonDocument.Parse(await early.Content.ReadAsStringAsync()).RootElement.GetProperty("detail").GetString());
        }

        using HttpClient board = await BoardClientAsync();
        using JsonDocument ranking = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/cycles/{cycle.Id}/ranking"));
        var row = ranking.RootElement.GetProperty("rows")[0];
        // Outside reference: Microsoft.VisualBasic.Financial.PV at 8 % over ten years.
        Assert.Equal(-80_000 - Financial.PV(0.08, 10, 16_000), row.GetProperty("presentWorth").GetDouble(), 6);
        Assert.Equal("unique", row.GetProperty("rateOfReturnKind").GetString());
        Assert.Equal(draft.Reference, row.GetProperty("reference").GetString());

        using var bad = await board.GetAsync($"/api/v1/cycles/{cycle.Id}/ranking?shift=99");
        Assert.Equal(HttpStatusCode.BadRequest, bad.StatusCode);
        Assert.Contains("shift", await bad.Content.ReadAsStringAsync());

        using HttpClient leadClient = await factory.CreateAuthenticatedClientAsync();
        using var refused = await leadClient.GetAsync($"/api/v1/cycles/{cycle.Id}/ranking");
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
    }
}
