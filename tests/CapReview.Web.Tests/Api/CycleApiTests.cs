using System.Net;
using System.Text.Json;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Api;

public sealed class CycleApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private async Task<HttpClient> FinanceClientAsync() => (await factory.TokenClientAsync("api.finance@tarnby.example", RoleNames.Finance)).Client;

    [Fact]
    public async Task Finance_reads_the_cycles_and_a_cycles_ranking_and_a_lead_is_refused_the_ranking()
    {
        var (cycle, draft) = await factory.CycleWithSubmittedProposalAsync("API cycle", 0.08, ApiFactory.Draft("Press", 10, 80_000, 16_000, costLabel: "Press"), "api-lead");

        using HttpClient finance = await FinanceClientAsync();
        using JsonDocument cycles = JsonDocument.Parse(await finance.GetStringAsync("/api/v1/cycles"));
        Assert.Contains(cycles.RootElement.EnumerateArray(), c => c.GetProperty("name").GetString() == "API cycle");

        using JsonDocument ranking = JsonDocument.Parse(await finance.GetStringAsync($"/api/v1/cycles/{cycle.Id}/ranking"));
        var row = ranking.RootElement.GetProperty("rows")[0];
        // Outside reference: Microsoft.VisualBasic.Financial.PV at 8 % over ten years.
        Assert.Equal(-80_000 - Financial.PV(0.08, 10, 16_000), row.GetProperty("presentWorth").GetDouble(), 6);
        Assert.Equal("unique", row.GetProperty("rateOfReturnKind").GetString());
        Assert.Equal(draft.Reference, row.GetProperty("reference").GetString());

        using var bad = await finance.GetAsync($"/api/v1/cycles/{cycle.Id}/ranking?shift=99");
        Assert.Equal(HttpStatusCode.BadRequest, bad.StatusCode);
        Assert.Contains("shift", await bad.Content.ReadAsStringAsync());

        using HttpClient leadClient = await factory.CreateAuthenticatedClientAsync();
        using var refused = await leadClient.GetAsync($"/api/v1/cycles/{cycle.Id}/ranking");
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
    }
}
