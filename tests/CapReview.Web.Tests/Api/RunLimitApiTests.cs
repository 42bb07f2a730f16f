using System.Net;
using System.Text;
using System.Text.Json;
using CapReview.Reviews.Access;
using CapReview.Reviews.Runs;
using CapReview.Web.Identity;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// The run limits through the API (docs/operations.md, "Simulations and the solver"): one person's runs at once, the
/// server's, and the work one run may ask for. A refusal is 429 with problem details and Retry-After, or a 400 naming
/// risk.trials; nothing waits.
/// </summary>
public sealed class RunLimitApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static string Request(int trials, int horizon = 10) => $$$"""
        {"model": {"horizon": {{{horizon}}}, "rate": {"value": 0.10},
           "elements": [
             {"id": "plant", "type": "single", "label": "Plant", "category": "capital", "period": 0, "amount": -400000},
             {"id": "saving", "type": "uniform", "label": "Saving", "category": "revenue", "first": 1, "last": {{{horizon}}}, "amount": 70000}]},
         "risk": {"trials": {{{trials}}}, "parameters": [{"name": "Saving", "target": "elements[#saving].amount", "low": 50000, "mostLikely": 70000, "high": 90000}]}}
        """;

    private static async Task<(HttpStatusCode Status, JsonElement Body, HttpResponseMessage Response)> PostAsync(HttpClient client, string json)
    {
        var response = await client.PostAsync(new Uri("/api/v1/risk-analyses", UriKind.Relative), new StringContent(json, Encoding.UTF8, "application/json"));
        return (response.StatusCode, JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.Clone(), response);
    }

    [Fact]
    public async Task A_person_with_as_many_runs_as_allowed_gets_429_until_one_ends()
    {
        var (client, userId) = await factory.TokenClientAsync("runs.lead@tarnby.example", RoleNames.ProjectLead);
        using (client)
        {
            var limiter = factory.Services.GetRequiredService<RunLimiter>();
            var self = Actor.Of(userId, "Runs Lead", Role.ProjectLead);
            using (limiter.Enter(self))
            {
                using (limiter.Enter(self))
                {
                    var (status, body, response) = await PostAsync(client, Request(500));
                    using (response)
                    {
                        Assert.Equal(HttpStatusCode.TooManyRequests, status);
                        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
                        Assert.Equal("10", response.Headers.GetValues("Retry-After").Single());
                        Assert.Contains("You already have 2 simulations or portfolio calculations running", body.GetProperty("detail").GetString(), StringComparison.Ordinal);
                    }
                }
                // One of the two ended: the person's next run starts.
                var (again, _, answer) = await PostAsync(client, Request(500));
                answer.Dispose();
                Assert.Equal(HttpStatusCode.OK, again);
            }
            Assert.Equal(0, limiter.Running);
        }
    }

    [Fact]
    public async Task A_server_running_as_many_as_it_allows_answers_429_to_everyone_else()
    {
        var (client, _) = await factory.TokenClientAsync("runs.other@tarnby.example", RoleNames.Reviewer);
        using (client)
        {
            var limiter = factory.Services.GetRequiredService<RunLimiter>();
            var leases = Enumerable.Range(1, limiter.Options.PerServer).Select(k => limiter.Enter(Actor.Of($"busy-{k}", "Busy", Role.ProjectLead))).ToList();
            try
            {
                var (status, body, response) = await PostAsync(client, Request(500));
                response.Dispose();
                Assert.Equal(HttpStatusCode.TooManyRequests, status);
                Assert.Contains("The server is already running 4", body.GetProperty("detail").GetString(), StringComparison.Ordinal);
                // The portfolio solver is a run too: any cycle id, since the limit is checked before the solver, after the read.
                var (cycle, _) = await factory.CycleWithSubmittedProposalAsync("Runs cycle", 0.08, ApiFactory.Draft("Kiln", 8, 64_000, 11_000), "runs-lead");
                using var portfolio = await client.GetAsync(new Uri($"/api/v1/cycles/{cycle.Id}/portfolio", UriKind.Relative));
                Assert.Equal(HttpStatusCode.TooManyRequests, portfolio.StatusCode);
                Assert.Equal("application/problem+json", portfolio.Content.Headers.ContentType?.MediaType);
            }
            finally
            {
                leases.ForEach(l => l.Dispose());
            }
        }
    }

    [Fact]
    public async Task A_run_over_the_work_budget_is_refused_naming_risk_trials()
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        // 1,000,000 trials × 1,201 periods × 2 elements = 2,402,000,000 units, over the default 2,000,000,000.
        var (status, body, response) = await PostAsync(client, Request(1_000_000, horizon: 1200));
        response.Dispose();
        Assert.Equal(HttpStatusCode.BadRequest, status);
        string message = Assert.Single(body.GetProperty("errors").GetProperty("risk.trials").EnumerateArray()).GetString()!;
        Assert.Contains("2,402,000,000 units of work", message, StringComparison.Ordinal);
        Assert.Contains("at most 2,000,000,000", message, StringComparison.Ordinal);
    }
}
