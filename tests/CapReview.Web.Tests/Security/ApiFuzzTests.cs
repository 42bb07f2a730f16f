using System.Net;
using System.Text;
using CapReview.Engine.CashFlows;
using CapReview.Reviews.Storage;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using CsCheck;
using Microsoft.AspNetCore.Hosting;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Security;

/// <summary>
/// Generated bad input against every JSON endpoint that takes a body, and against the query strings and route values
/// of the reading endpoints: never a 5xx, a refusal is problem details, and a refused request stores nothing (the
/// domain's tables and the end of its audit chain are as before). A mutated body that is still valid may be accepted;
/// then exactly what it asked for is stored.
/// </summary>
public sealed class ApiFuzzTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Evaluation = """
        {"periodsPerYear":1,"horizon":8,"rate":{"value":0.09,"basis":"nominal","compoundingsPerYear":12},
         "elements":[{"type":"single","label":"Kiln","category":"capital","period":0,"amount":-64000},
                     {"type":"arithmetic","label":"Gas saved","category":"operating","first":1,"last":8,"amount":9000,"step":400},
                     {"type":"geometric","label":"Upkeep","category":"operating","first":1,"last":8,"amount":-1200,"growth":0.03},
                     {"type":"recurring","label":"Relining","category":"capital","first":3,"last":6,"every":3,"amount":-5000},
                     {"type":"single","label":"Resale","category":"salvage","period":8,"amount":6000,"money":"constant","escalation":0.02}],
         "inflation":{"rate":0.02,"realMarr":true}}
        """;

    private const string Draft = """
        {"title":"Kiln burner retrofit","description":"Fuzzed","category":"costReduction","riskClass":"low",
         "assumptions":{"model":{"horizon":8,"elements":[{"type":"single","label":"Kiln","category":"capital","period":0,"amount":-64000},
                                                         {"type":"uniform","label":"Gas saved","category":"operating","first":1,"last":8,"amount":11000}]}}}
        """;

    private WebApplicationFactoryWithoutLimits? _unlimited;

    [Fact]
    public async Task Mutated_evaluation_requests_never_fail_with_5xx_and_store_nothing()
    {
        using HttpClient lead = await ClientAsync("fuzz.lead@tarnby.example", RoleNames.ProjectLead);
        await AssertRefusalsStoreNothingAsync(lead, "/api/v1/evaluations", Evaluation, accepted: HttpStatusCode.OK, acceptedStores: false, iterations: 1000);
    }

    [Fact]
    public async Task Extreme_but_valid_evaluations_never_fail_with_5xx_and_every_null_measure_has_its_reason()
    {
        // Rates at the −40% bound, 0, ±10^−323 and 1000%, horizons of 1 and 1,200 periods, amounts at ±10^12 and at the
        // smallest double (docs/api.md): a 200 whose every number is finite and every null measure explained, or a 400.
        using HttpClient lead = await ClientAsync("fuzz.lead@tarnby.example", RoleNames.ProjectLead);
        int answered = 0;
        await ExtremeJson.Evaluation.SampleAsync(async body =>
        {
            using var answer = await lead.PostAsync(new Uri("/api/v1/evaluations", UriKind.Relative), new StringContent(body, Encoding.UTF8, "application/json"));
            string text = await answer.Content.ReadAsStringAsync();
            Assert.True((int)answer.StatusCode < 500, $"POST /api/v1/evaluations answered {(int)answer.StatusCode} to: {Shorten(body)}");
            using var json = System.Text.Json.JsonDocument.Parse(text);
            Api.FiniteNumbers.Assert(json.RootElement, "evaluation");
            if (answer.StatusCode == HttpStatusCode.OK)
            {
                answered++;
                Api.FiniteNumbers.AssertNullsExplained(json.RootElement, body);
                if (json.RootElement.TryGetProperty("afterTax", out var afterTax))
                {
                    Api.FiniteNumbers.AssertNullsExplained(afterTax.GetProperty("measures"), body);
                }
            }
        }, iter: 400, threads: 1);
        Assert.True(answered > 50, $"Only {answered} of 400 extreme bodies were evaluated: the generator barely reached the measures.");
    }

    [Fact]
    public async Task Extreme_but_valid_risk_analyses_never_fail_with_5xx()
    {
        using HttpClient lead = await ClientAsync("fuzz.lead@tarnby.example", RoleNames.ProjectLead);
        await ExtremeJson.RiskAnalysis.SampleAsync(async body =>
        {
            using var answer = await lead.PostAsync(new Uri("/api/v1/risk-analyses", UriKind.Relative), new StringContent(body, Encoding.UTF8, "application/json"));
            string text = await answer.Content.ReadAsStringAsync();
            Assert.True((int)answer.StatusCode < 500, $"POST /api/v1/risk-analyses answered {(int)answer.StatusCode} to: {Shorten(body)}");
            using var json = System.Text.Json.JsonDocument.Parse(text);
            Api.FiniteNumbers.Assert(json.RootElement, "risk analysis");
        }, iter: 150, threads: 1);
    }

    [Fact]
    public async Task Mutated_drafts_never_fail_with_5xx_and_a_refused_one_stores_nothing()
    {
        using HttpClient lead = await ClientAsync("fuzz.lead@tarnby.example", RoleNames.ProjectLead);
        await AssertRefusalsStoreNothingAsync(lead, "/api/v1/proposals", Draft, accepted: HttpStatusCode.Created, acceptedStores: true, iterations: 600);
    }

    [Fact]
    public async Task A_draft_with_a_number_beyond_any_double_is_refused_naming_it_not_a_500()
    {
        // Found by the draft fuzzer (seed 0iqk8aoMdik8): 1e400 is valid JSON but no double holds it.
        using HttpClient lead = await ClientAsync("fuzz.lead@tarnby.example", RoleNames.ProjectLead);
        string body = Draft.Replace("\"amount\":-64000", "\"amount\":-64000,\"escalation\":1e400", StringComparison.Ordinal);
        Assert.NotEqual(Draft, body);
        using var answer = await lead.PostAsync(new Uri("/api/v1/proposals", UriKind.Relative), new StringContent(body, System.Text.Encoding.UTF8, "application/json"));
        string problem = await answer.Content.ReadAsStringAsync();
        Assert.True(answer.StatusCode == HttpStatusCode.BadRequest, problem);
        Assert.Contains("escalation", problem, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Mutated_cycle_documents_never_fail_with_5xx_and_a_refused_one_stores_nothing()
    {
        using HttpClient admin = await ClientAsync("fuzz.admin@tarnby.example", RoleNames.Administrator);
        int cycleId = await CycleWithProposalAsync();
        string document = await admin.GetStringAsync(new Uri($"/api/v1/cycles/{cycleId}/document", UriKind.Relative));
        await AssertRefusalsStoreNothingAsync(admin, "/api/v1/cycles/import", document, accepted: HttpStatusCode.Created, acceptedStores: true, iterations: 300);
    }

    [Fact]
    public async Task Mutated_decisions_never_fail_with_5xx_and_a_refused_one_stores_nothing()
    {
        using HttpClient board = await ClientAsync("fuzz.board@tarnby.example", RoleNames.Reviewer);
        var (cycle, proposal) = await factory.CycleWithSubmittedProposalAsync("Fuzz decisions " + Guid.NewGuid().ToString("N")[..6], 0.09,
            ApiFactory.Draft("Kiln burner", 8, 64_000, 11_000, "Kiln", "Gas saved", CashFlowCategory.Operating), "fuzz-lead");
        string decision = $$$"""{"proposalId":{{{proposal.Id}}},"outcome":"returnForChanges","conditions":"Fuzzed","version":1,"revision":{{{proposal.Revision}}}}""";
        await AssertRefusalsStoreNothingAsync(board, $"/api/v1/cycles/{cycle.Id}/decisions", decision, accepted: HttpStatusCode.Created, acceptedStores: true, iterations: 300);
    }

    [Fact]
    public async Task Mutated_draft_edits_never_fail_with_5xx_and_a_refused_one_stores_nothing()
    {
        var (tokenClient, leadId) = await factory.TokenClientAsync("fuzz.editor@tarnby.example", RoleNames.ProjectLead);
        tokenClient.Dispose();
        using HttpClient lead = await ClientAsync("fuzz.editor@tarnby.example", RoleNames.ProjectLead);
        var created = await factory.Services.GetRequiredService<CapReview.Reviews.Proposals.ProposalService>().CreateDraftAsync(
            CapReview.Reviews.Access.Actor.Of(leadId, "Fuzz editor", CapReview.Reviews.Access.Role.ProjectLead),
            ApiFactory.Draft("Kiln burner", 8, 64_000, 11_000, "Kiln", "Gas saved", CashFlowCategory.Operating), CancellationToken.None);
        // Every accepted edit raises the revision, so later mutations of this body meet a stale revision (409) unless
        // the mutation itself changed the revision to the current one: most are refused, as a person's stale tab would be.
        string edit = """{"revision":REVISION,"assumptions":{"model":{"horizon":8,"elements":[{"type":"single","label":"Kiln","category":"capital","period":0,"amount":-64000},{"type":"uniform","label":"Gas saved","category":"operating","first":1,"last":8,"amount":12000}]}}}"""
            .Replace("REVISION", created.Revision.ToString(System.Globalization.CultureInfo.InvariantCulture), StringComparison.Ordinal);
        await AssertRefusalsStoreNothingAsync(lead, $"/api/v1/proposals/{created.Id}/versions/1", edit, accepted: HttpStatusCode.OK, acceptedStores: true, iterations: 300, HttpMethod.Put);
    }

    [Fact]
    public async Task Generated_route_values_and_query_strings_never_fail_with_5xx_and_store_nothing()
    {
        using HttpClient finance = await ClientAsync("fuzz.finance@tarnby.example", RoleNames.Finance);
        int cycleId = await CycleWithProposalAsync();
        string[] paths = [$"/api/v1/cycles/{cycleId}/ranking", "/api/v1/cycles/{0}/ranking", "/api/v1/proposals/{0}", "/api/v1/proposals/{0}/versions/{0}",
            "/api/v1/cycles/{0}/document", "/api/v1/cycles/{0}/packets", "/api/v1/proposals", "/api/v1/cycles"];
        string[] keys = ["shift", "scale", "element", "rate", "marr", "budget", "sort", "life", "cost", "saving", "id", "format"];
        var requests = Gen.Select(Gen.Int[0, paths.Length - 1], JsonFuzz.Scalar, Gen.Select(Gen.OneOf<string>(keys), JsonFuzz.Scalar).Array[0, 4]);
        string before = await StoredStateAsync();
        await requests.SampleAsync(async (path, routeValue, query) =>
        {
            string route = paths[path].Replace("{0}", Uri.EscapeDataString(routeValue.Trim('"')), StringComparison.Ordinal);
            string address = route + (query.Length == 0 ? "" : "?" + string.Join("&", query.Select(q => q.Item1 + "=" + Uri.EscapeDataString(q.Item2.Trim('"')))));
            using var answer = await finance.GetAsync(new Uri(address, UriKind.Relative));
            Assert.True((int)answer.StatusCode < 500, $"GET {address} answered {(int)answer.StatusCode}");
            if (answer.Content.Headers.ContentType?.MediaType?.EndsWith("json", StringComparison.Ordinal) == true)
            {
                using var json = System.Text.Json.JsonDocument.Parse(await answer.Content.ReadAsStringAsync());
                Api.FiniteNumbers.Assert(json.RootElement, "GET " + address);
            }
        }, iter: 600, threads: 1);
        Assert.Equal(before, await StoredStateAsync());
    }

    private async Task AssertRefusalsStoreNothingAsync(HttpClient client, string path, string valid, HttpStatusCode accepted, bool acceptedStores, int iterations,
        HttpMethod? method = null)
    {
        string state = await StoredStateAsync();
        int refused = 0;
        await JsonFuzz.Samples.SampleAsync(async c =>
        {
            string body = JsonFuzz.Apply(valid, c);
            using var request = new HttpRequestMessage(method ?? HttpMethod.Post, new Uri(path, UriKind.Relative))
            {
                Content = new StringContent(body, Encoding.UTF8, "application/json"),
            };
            using var answer = await client.SendAsync(request);
            int status = (int)answer.StatusCode;
            Assert.True(status < 500, $"{method ?? HttpMethod.Post} {path} answered {status} to: {Shorten(body)}");
            string now = await StoredStateAsync();
            if (answer.StatusCode == accepted)
            {
                Assert.True(acceptedStores ? now != state : now == state, $"POST {path} answered {status}; stored state {state} → {now}");
                state = now;
                return;
            }
            refused++;
            Assert.InRange(status, 400, 499);
            Assert.Equal("application/problem+json", answer.Content.Headers.ContentType?.MediaType);
            Assert.True(now == state, $"A refused POST {path} ({status}) changed what is stored: {state} → {now}; body {Shorten(body)}");
        }, iter: iterations, threads: 1);
        Assert.True(refused > iterations / 2, $"Only {refused} of {iterations} generated bodies were refused: the fuzzing barely left the valid input.");
    }

    /// <summary>How many rows each domain table holds and the hash at the end of the audit chain, which every change extends.</summary>
    private async Task<string> StoredStateAsync()
    {
        await using CapReviewDbContext db = await factory.Services.GetRequiredService<IDbContextFactory<CapReviewDbContext>>().CreateDbContextAsync();
        int[] counts =
        [
            await db.Proposals.CountAsync(), await db.ProposalVersions.CountAsync(), await db.BudgetCycles.CountAsync(), await db.MarrPolicyVersions.CountAsync(),
            await db.Decisions.CountAsync(), await db.SignOffs.CountAsync(), await db.Comments.CountAsync(), await db.ExclusiveGroups.CountAsync(),
            await db.Contingencies.CountAsync(), await db.ApprovalPackets.CountAsync(), await db.AuditEvents.CountAsync(),
        ];
        string? last = await db.AuditEvents.OrderByDescending(e => e.Id).Select(e => e.Hash).FirstOrDefaultAsync();
        return string.Join(",", counts) + "/" + last;
    }

    private async Task<HttpClient> ClientAsync(string email, string role)
    {
        var (tokenClient, _) = await factory.TokenClientAsync(email, role);
        // The same database and token, with the API's rate limit out of the way of a thousand requests a minute.
        _unlimited ??= new WebApplicationFactoryWithoutLimits(factory);
        HttpClient client = _unlimited.Factory.CreateClient();
        client.DefaultRequestHeaders.Authorization = tokenClient.DefaultRequestHeaders.Authorization;
        tokenClient.Dispose();
        return client;
    }

    private async Task<int> CycleWithProposalAsync() => (await factory.CycleWithSubmittedProposalAsync("Fuzz cycle " + Guid.NewGuid().ToString("N")[..6], 0.09,
        ApiFactory.Draft("Kiln burner", 8, 64_000, 11_000, "Kiln", "Gas saved", CashFlowCategory.Operating), "fuzz-lead")).Cycle.Id;

    private static string Shorten(string body) => body.Length <= 400 ? body : body[..400] + "…";

    /// <summary>The fixture's app on the same database with the API's rate limit raised; disposed with the fixture's host.</summary>
    private sealed class WebApplicationFactoryWithoutLimits(ApiFactory factory)
    {
        public Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactory<Program> Factory { get; } =
            factory.WithWebHostBuilder(builder => builder.UseSetting("RateLimits:ApiPerMinute", "1000000"));
    }
}
