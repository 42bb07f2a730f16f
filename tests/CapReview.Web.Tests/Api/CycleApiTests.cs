using System.Net;
using System.Text.Json;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
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
        var admin = Actor.Of("api-admin", "API Admin", Role.Administrator);
        var lead = Actor.Of("api-lead", "API Lead", Role.ProjectLead);
        var marr = await factory.Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "API policy"), CancellationToken.None);
        var cycle = await factory.Services.GetRequiredService<CycleService>().CreateAsync(admin,
            new NewBudgetCycle("API cycle", 500_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var draft = await proposals.CreateDraftAsync(lead, new ProposalDraft("Press", "", ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = 10,
                Elements =
                [
                    new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -80_000 },
                    new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 16_000 },
                ],
            },
        }, null), CancellationToken.None);
        await proposals.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);

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
