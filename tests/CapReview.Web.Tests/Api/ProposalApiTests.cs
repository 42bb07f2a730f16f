using System.Net;
using System.Net.Http.Json;
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

public sealed class ProposalApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private async Task<HttpClient> ClientAsync(string email, string role) => (await factory.TokenClientAsync(email, role)).Client;

    [Fact]
    public async Task A_lead_starts_a_draft_reads_it_and_its_version_and_another_lead_finds_nothing()
    {
        var admin = Actor.Of("proposal-api-admin", "Admin", Role.Administrator);
        await factory.Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.07, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "API policy"), CancellationToken.None);
        using HttpClient lead = await ClientAsync("proposal.api.lead@tarnby.example", RoleNames.ProjectLead);
        using var created = await lead.PostAsJsonAsync("/api/v1/proposals", new
        {
            title = "Loading dock doors",
            assumptions = new
            {
                model = new
                {
                    horizon = 12,
                    elements = new object[]
                    {
                        new { type = "single", label = "Doors", category = "capital", period = 0, amount = -36_000 },
                        new { type = "uniform", label = "Heat kept in", category = "operating", first = 1, last = 12, amount = 5_100 },
                    },
                },
            },
        });
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        using JsonDocument draft = JsonDocument.Parse(await created.Content.ReadAsStringAsync());
        int id = draft.RootElement.GetProperty("id").GetInt32();
        Assert.Equal($"/api/v1/proposals/{id}", created.Headers.Location!.OriginalString);
        Assert.Equal("other", draft.RootElement.GetProperty("category").GetString());

        using JsonDocument own = JsonDocument.Parse(await lead.GetStringAsync("/api/v1/proposals"));
        Assert.Contains(own.RootElement.EnumerateArray(), p => p.GetProperty("id").GetInt32() == id);

        using JsonDocument version = JsonDocument.Parse(await lead.GetStringAsync($"/api/v1/proposals/{id}/versions/1"));
        Assert.Equal(12, version.RootElement.GetProperty("assumptions").GetProperty("model").GetProperty("horizon").GetInt32());
        // Outside reference: Microsoft.VisualBasic.Financial.PV at the policy's 7 % over twelve years.
        Assert.Equal(-36_000 - Financial.PV(0.07, 12, 5_100), version.RootElement.GetProperty("evaluation").GetProperty("presentWorth").GetDouble(), 6);

        using HttpClient other = await ClientAsync("proposal.api.other@tarnby.example", RoleNames.ProjectLead);
        Assert.Equal(HttpStatusCode.NotFound, (await other.GetAsync($"/api/v1/proposals/{id}")).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await other.GetAsync($"/api/v1/proposals/{id}/versions/1")).StatusCode);
        Assert.Equal(HttpStatusCode.NotFound, (await lead.GetAsync($"/api/v1/proposals/{id}/versions/2")).StatusCode);

        using HttpClient finance = await ClientAsync("proposal.api.finance@tarnby.example", RoleNames.Finance);
        using var refused = await finance.PostAsJsonAsync("/api/v1/proposals", new { title = "Not mine to start", assumptions = new { model = new { horizon = 1 } } });
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        using var badCategory = await lead.PostAsync("/api/v1/proposals", new StringContent("""{"title":"x","category":"luxury","assumptions":{"model":{}}}""", System.Text.Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.BadRequest, badCategory.StatusCode);
        Assert.Contains("\"category\"", await badCategory.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_board_member_lists_a_cycles_proposals_and_the_packets_list_is_empty_before_a_decision()
    {
        var admin = Actor.Of("proposal-api-admin", "Admin", Role.Administrator);
        var marr = await factory.Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "API cycle policy"), CancellationToken.None);
        var cycle = await factory.Services.GetRequiredService<CycleService>().CreateAsync(admin,
            new NewBudgetCycle("Proposal API cycle", 100_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var owner = Actor.Of("proposal-api-owner", "Owner", Role.ProjectLead);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var draft = await proposals.CreateDraftAsync(owner, new ProposalDraft("Sorter", "", ProposalCategory.Expansion, RiskClass.Standard, new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = 6,
                Elements = [new ElementSpec { Type = ElementKind.Single, Label = "Sorter", Category = CashFlowCategory.Capital, Period = 0, Amount = -50_000 },
                            new ElementSpec { Type = ElementKind.Uniform, Label = "Labour", Category = CashFlowCategory.Operating, First = 1, Last = 6, Amount = 12_000 }],
            },
        }, null), CancellationToken.None);
        await proposals.SubmitAsync(owner, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);

        using HttpClient board = await ClientAsync("proposal.api.board@tarnby.example", RoleNames.Reviewer);
        using JsonDocument listed = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/proposals?cycle={cycle.Id}"));
        var sorter = Assert.Single(listed.RootElement.EnumerateArray());
        Assert.Equal("submitted", sorter.GetProperty("status").GetString());
        Assert.True(sorter.GetProperty("versions")[0].GetProperty("frozen").GetBoolean());
        Assert.Equal(HttpStatusCode.BadRequest, (await board.GetAsync("/api/v1/proposals?cycle=abc")).StatusCode);

        using JsonDocument packets = JsonDocument.Parse(await board.GetStringAsync($"/api/v1/cycles/{cycle.Id}/packets"));
        Assert.Equal(0, packets.RootElement.GetArrayLength());
        Assert.Equal(HttpStatusCode.NotFound, (await board.GetAsync("/api/v1/packets/999999")).StatusCode);
    }
}
