using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// A lead's proposal at the edge of what may be entered: a MARR of its own at the −40% bound over 1,200 years of
/// receipts of 10^12. At the cycle's terms it is ranked; a what-if shift of −10 points takes its worth past every
/// double, and then it is listed as not ranked, with the reason, on every read of the cycle, while the other proposal
/// is ranked and selected as ever. No legal input answers 5xx; every number written is finite.
/// </summary>
public sealed class UnevaluableProposalTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static ProposalDraft Dam(double marr) => new("Drought reservoir", "", ProposalCategory.Expansion, RiskClass.Standard, new ProposalAssumptions
    {
        Model = new ModelSpec
        {
            Horizon = 1200,
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Dam", Category = CashFlowCategory.Capital, Period = 0, Amount = -1e12 },
                new ElementSpec { Type = ElementKind.Uniform, Label = "Water sold", Category = CashFlowCategory.Revenue, First = 1, Last = 1200, Amount = 1e12 },
            ],
        },
        MarrOverride = new MarrOverride(new RateSpec { Value = marr }, "Water is worth more each year than money"),
    }, null);

    private async Task<(int CycleId, int KilnId, int DamId)> CycleAsync()
    {
        var (cycle, kiln) = await factory.CycleWithSubmittedProposalAsync("Edge cycle " + Guid.NewGuid().ToString("N")[..6], 0.08,
            ApiFactory.Draft("Kiln burner", 8, 64_000, 11_000), "edge-lead");
        var lead = Actor.Of("edge-lead", "Edge Lead", Role.ProjectLead);
        var proposals = factory.Services.GetRequiredService<ProposalService>();
        var dam = await proposals.CreateDraftAsync(lead, Dam(-0.40), CancellationToken.None);
        dam = await proposals.SubmitAsync(lead, dam.Id, cycle.Id, dam.Revision, CancellationToken.None);
        // The two as alternatives, so that the incremental analysis meets the dam too.
        await factory.Services.GetRequiredService<PortfolioRulesService>().SaveGroupAsync(Actor.Of("edge-admin", "Edge Admin", Role.Administrator), cycle.Id,
            new GroupDraft("Water or heat", false, [kiln.Id, dam.Id]), CancellationToken.None);
        return (cycle.Id, kiln.Id, dam.Id);
    }

    [Fact]
    public async Task A_MARR_of_its_own_below_the_bound_is_refused_naming_the_field()
    {
        var lead = Actor.Of("edge-lead", "Edge Lead", Role.ProjectLead);
        var refused = await Assert.ThrowsAsync<CapReview.Reviews.Common.RuleViolationException>(() =>
            factory.Services.GetRequiredService<ProposalService>().CreateDraftAsync(lead, Dam(-0.9999999), CancellationToken.None));
        Assert.Equal("marrOverride.rate.value", refused.Field);
        Assert.StartsWith("The proposal's own MARR, rate: ", refused.Message, StringComparison.Ordinal);
        Assert.Contains("−40%", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Every_read_of_the_cycle_answers_and_lists_the_unevaluable_proposal_with_its_reason()
    {
        var (cycleId, kilnId, damId) = await CycleAsync();
        var (board, _) = await factory.TokenClientAsync("edge.board@tarnby.example", RoleNames.Reviewer);
        using (board)
        {
            // At the cycle's own terms the dam is ranked: −40% keeps its worth (about 10^278) within every double.
            JsonElement own = await JsonAsync(board, $"/api/v1/cycles/{cycleId}/ranking");
            Assert.Equal(2, own.GetProperty("rows").GetArrayLength());
            // A row's null measure has its reason; a measure with a value has none.
            foreach (JsonElement ranked in own.GetProperty("rows").EnumerateArray())
            {
                foreach (string field in new[] { "externalRate", "discountedPaybackYears", "benefitCostRatio" })
                {
                    bool explained = ranked.GetProperty("unavailable").TryGetProperty(field, out _);
                    Assert.Equal(ranked.GetProperty(field).ValueKind == JsonValueKind.Null, explained);
                }
            }

            JsonElement shifted = await JsonAsync(board, $"/api/v1/cycles/{cycleId}/ranking?shift=-10");
            JsonElement row = Assert.Single(shifted.GetProperty("rows").EnumerateArray());
            Assert.Equal(kilnId, row.GetProperty("proposalId").GetInt32());
            JsonElement unranked = Assert.Single(shifted.GetProperty("unranked").EnumerateArray());
            Assert.Equal(damId, unranked.GetProperty("proposalId").GetInt32());
            Assert.Contains("beyond the largest number", unranked.GetProperty("reason").GetString(), StringComparison.Ordinal);

            JsonElement portfolio = await JsonAsync(board, $"/api/v1/cycles/{cycleId}/portfolio?shift=-10");
            Assert.Single(portfolio.GetProperty("candidates").EnumerateArray());
            Assert.Contains(portfolio.GetProperty("excluded").EnumerateArray(), e => e.GetProperty("proposalId").GetInt32() == damId
                && e.GetProperty("reason").GetString()!.Contains("beyond the largest number", StringComparison.Ordinal));

            foreach (string format in new[] { "csv", "xlsx" })
            {
                foreach (string view in new[] { "ranking", "portfolio" })
                {
                    using var download = await board.GetAsync(new Uri($"/cycles/{cycleId}/{view}/{format}?shift=-10", UriKind.Relative));
                    Assert.Equal(HttpStatusCode.OK, download.StatusCode);
                    if (format == "csv")
                    {
                        string text = await download.Content.ReadAsStringAsync();
                        Assert.Contains(view == "ranking" ? "not ranked: its worth cannot be computed" : "left out: its worth cannot be computed", text, StringComparison.Ordinal);
                    }
                }
            }

            // Every read of the cycle and its proposals, at every what-if the API takes: never a 5xx, every number finite.
            foreach (string shift in new[] { "-10", "-2", "0", "2", "10" })
            {
                foreach (string basis in new[] { "beforeTax", "afterTax" })
                {
                    foreach (string objective in new[] { "presentWorth", "annualWorth" })
                    {
                        await JsonAsync(board, $"/api/v1/cycles/{cycleId}/ranking?shift={shift}&basis={basis}");
                        await JsonAsync(board, $"/api/v1/cycles/{cycleId}/portfolio?shift={shift}&basis={basis}&objective={objective}&limit=79228162514264337593543950335");
                    }
                }
            }
            foreach (int id in new[] { kilnId, damId })
            {
                await JsonAsync(board, $"/api/v1/proposals/{id}");
                await JsonAsync(board, $"/api/v1/proposals/{id}/versions/1");
                await JsonAsync(board, $"/api/v1/proposals/{id}/versions/1/incremental");
                await JsonAsync(board, $"/api/v1/proposals/{id}/versions/1/replacement", allowed: HttpStatusCode.BadRequest);
            }
            await JsonAsync(board, $"/api/v1/cycles/{cycleId}/portfolio-rules");
            await JsonAsync(board, $"/api/v1/cycles/{cycleId}/document");
        }
    }

    /// <summary>GETs <paramref name="path"/>: 200 (or <paramref name="allowed"/>), JSON whose every number is a finite double.</summary>
    private static async Task<JsonElement> JsonAsync(HttpClient client, string path, HttpStatusCode? allowed = null)
    {
        using var response = await client.GetAsync(new Uri(path, UriKind.Relative));
        string text = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK || response.StatusCode == allowed, $"GET {path} answered {(int)response.StatusCode}: {text}");
        JsonElement root = JsonDocument.Parse(text).RootElement.Clone();
        FiniteNumbers.Assert(root, path);
        return root;
    }
}
