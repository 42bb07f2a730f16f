using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using CapReview.Reviews.Cycles;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// Every page route and endpoint of the app against anonymous visitors and every role, against a cycle in each state
/// (open, in review, decided), from one table. A route the table does not know fails the test, so a new endpoint
/// cannot arrive without its rule.
/// </summary>
public sealed partial class AuthorizationMatrix(MatrixApp app) : IClassFixture<MatrixApp>
{
    private const string Anonymous = "anonymous";
    private static readonly string[] Who = [Anonymous, RoleNames.ProjectLead, RoleNames.Reviewer, RoleNames.Finance, RoleNames.Administrator];
    private static readonly CycleStatus[] States = [CycleStatus.Open, CycleStatus.InReview, CycleStatus.Decided];

    private const string Evaluation = """{"horizon":2,"rate":{"value":0.1},"elements":[{"type":"single","label":"a","category":"capital","period":0,"amount":-100},{"type":"uniform","label":"b","category":"revenue","first":1,"last":2,"amount":60}]}""";

    /// <summary>
    /// One route's rule: the answer each visitor (anonymous, lead, board, finance, administrator) gets against the open
    /// cycle, and where it differs, against the cycle in review (else as open) and the decided one (else as in review).
    /// </summary>
    private sealed record Rule(string Method, string Path, string[] Open, string[]? InReview = null, string[]? Decided = null)
    {
        public string[] In(CycleStatus state) => state switch
        {
            CycleStatus.Open => Open,
            CycleStatus.InReview => InReview ?? Open,
            _ => Decided ?? InReview ?? Open,
        };
    }

    // Expected outcome per visitor: 200 shown, 401 refused (API), "signin" redirected to the sign-in form, "denied"
    // redirected to the not-for-your-role page, "not-yet" a page that says the cycle's proposals are not the
    // visitor's to see until the cycle is decided, 400 refused for want of an antiforgery token or for a rule of the
    // cycle's state, 404 not theirs to see. Paths name the state's cycle ({cycle}), its first proposal ({proposal})
    // and that proposal's packet ({packet}, none before the cycle is decided). The matrix's lead owns none of them;
    // finance sees them once the cycle is decided, not before, not even a proposal approved while the cycle is in review.
    private static readonly Dictionary<string, Rule> Rules = new()
    {
        ["/"] = new("GET", "/", ["200", "200", "200", "200", "200"]),
        ["/signin"] = new("GET", "/signin", ["200", "200", "200", "200", "200"]),
        ["/denied"] = new("GET", "/denied", ["200", "200", "200", "200", "200"]),
        ["/account"] = new("GET", "/account", ["signin", "200", "200", "200", "200"]),
        ["/not-found"] = new("GET", "/not-found", ["200", "200", "200", "200", "200"]),
        ["/error"] = new("GET", "/error", ["200", "200", "200", "200", "200"]),
        ["/evaluate"] = new("GET", "/evaluate", ["signin", "200", "200", "200", "200"]),
        ["/proposals"] = new("GET", "/proposals", ["signin", "200", "denied", "denied", "denied"]),
        ["/proposals/new"] = new("GET", "/proposals/new", ["signin", "200", "200", "200", "200"]),
        // Issue 17: a proposal not the visitor's to see is the app's not-found page, with its 404.
        ["/proposals/{Id:int}"] = new("GET", "/proposals/{proposal}", ["signin", "404", "200", "404", "200"], Decided: ["signin", "404", "200", "200", "200"]),
        ["/cycles"] = new("GET", "/cycles", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}"] = new("GET", "/cycles/{cycle}", ["signin", "denied", "200", "not-yet", "200"], Decided: ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}/ranking"] = new("GET", "/cycles/{cycle}/ranking", ["signin", "denied", "200", "not-yet", "200"], Decided: ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}/portfolio"] = new("GET", "/cycles/{cycle}/portfolio", ["signin", "denied", "200", "not-yet", "200"], Decided: ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{id:int}/ranking/{format:regex(^(csv|xlsx)$)}"] = new("GET", "/cycles/{cycle}/ranking/csv", ["signin", "denied", "200", "403", "200"], Decided: ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{id:int}/portfolio/{format:regex(^(csv|xlsx)$)}"] = new("GET", "/cycles/{cycle}/portfolio/xlsx", ["signin", "denied", "200", "403", "200"], Decided: ["signin", "denied", "200", "200", "200"]),
        ["/packets/{id:int}"] = new("GET", "/packets/{packet}", ["signin", "404", "404", "404", "404"], Decided: ["signin", "404", "200", "200", "200"]),
        ["/proposals/{id:int}/versions/{number:int}/xlsx"] = new("GET", "/proposals/{proposal}/versions/1/xlsx", ["signin", "404", "200", "404", "200"], Decided: ["signin", "404", "200", "200", "200"]),
        ["/proposals/{id:int}/versions/{number:int}/csv/{table}"] = new("GET", "/proposals/{proposal}/versions/1/csv/elements", ["signin", "404", "200", "404", "200"], Decided: ["signin", "404", "200", "200", "200"]),
        ["/proposals/{Id:int}/replacement"] = new("GET", "/proposals/{proposal}/replacement", ["signin", "404", "200", "404", "200"], Decided: ["signin", "404", "200", "200", "200"]),
        ["/admin/users"] = new("GET", "/admin/users", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/marr"] = new("GET", "/admin/marr", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/cycles"] = new("GET", "/admin/cycles", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/audit"] = new("GET", "/admin/audit", ["signin", "denied", "denied", "denied", "200"]),
        ["/api/v1/evaluations"] = new("POST", "/api/v1/evaluations", ["401", "200", "200", "200", "200"]),
        // The matrix posts an evaluation body: signed in, the risk analysis refuses it for want of its model and risk settings.
        ["/api/v1/risk-analyses"] = new("POST", "/api/v1/risk-analyses", ["401", "400", "400", "400", "400"]),
        ["/api/v1/cycles"] = new("GET", "/api/v1/cycles", ["401", "200", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/ranking"] = new("GET", "/api/v1/cycles/{cycle}/ranking", ["401", "403", "200", "403", "200"], Decided: ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/portfolio"] = new("GET", "/api/v1/cycles/{cycle}/portfolio?limit=500000&objective=annualWorth", ["401", "403", "200", "403", "200"], Decided: ["401", "403", "200", "200", "200"]),
        // The first proposal is in an exclusive group of its cycle and has no replacement estimates (400 for those who may see it).
        ["/api/v1/proposals/{id:int}/versions/{number:int}/incremental"] = new("GET", "/api/v1/proposals/{proposal}/versions/1/incremental", ["401", "404", "200", "404", "200"], Decided: ["401", "404", "200", "200", "200"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}/replacement"] = new("GET", "/api/v1/proposals/{proposal}/versions/1/replacement", ["401", "404", "400", "404", "400"], Decided: ["401", "404", "400", "400", "400"]),
        ["/api/v1/proposals"] = new("GET", "/api/v1/proposals?cycle={cycle}", ["401", "200", "200", "200", "200"]),
        // A new draft is the leads' own (each state's run adds one to the matrix lead's drafts, which nothing else reads).
        ["/api/v1/proposals#POST"] = new("POST", "/api/v1/proposals", ["401", "201", "403", "403", "403"]),
        ["/api/v1/proposals/{id:int}"] = new("GET", "/api/v1/proposals/{proposal}", ["401", "404", "200", "404", "200"], Decided: ["401", "404", "200", "200", "200"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}"] = new("GET", "/api/v1/proposals/{proposal}/versions/1", ["401", "404", "200", "404", "200"], Decided: ["401", "404", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/packets"] = new("GET", "/api/v1/cycles/{cycle}/packets", ["401", "200", "200", "200", "200"]),
        ["/api/v1/packets/{id:int}"] = new("GET", "/api/v1/packets/{packet}", ["401", "404", "404", "404", "404"], Decided: ["401", "404", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/document"] = new("GET", "/api/v1/cycles/{cycle}/document", ["401", "403", "200", "403", "200"]),
        ["/api/v1/cycles/{id:int}/document/signed"] = new("GET", "/api/v1/cycles/{cycle}/document/signed", ["401", "403", "200", "403", "200"]),
        ["/api/v1/cycles/import"] = new("POST", "/api/v1/cycles/import", ["401", "403", "403", "403", "400"]),
        ["/openapi/{documentName}.json"] = new("GET", "/openapi/v1.json", ["401", "200", "200", "200", "200"]),
        ["/health/live"] = new("GET", "/health/live", ["200", "200", "200", "200", "200"]),
        ["/health/ready"] = new("GET", "/health/ready", ["200", "200", "200", "200", "200"]),
        ["/signout"] = new("POST", "/signout", ["400", "400", "400", "400", "400"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}#PUT"] = new("PUT", "/api/v1/proposals/{proposal}/versions/1", ["401", "404", "403", "404", "403"], Decided: ["401", "404", "403", "403", "403"]),
        ["/api/v1/proposals/{id:int}/versions"] = new("POST", "/api/v1/proposals/{proposal}/versions", ["401", "404", "403", "404", "403"], Decided: ["401", "404", "403", "403", "403"]),
        ["/api/v1/proposals/{id:int}/submissions"] = new("POST", "/api/v1/proposals/{proposal}/submissions", ["401", "404", "403", "404", "403"], Decided: ["401", "404", "403", "403", "403"]),
        // An approved proposal cannot be withdrawn by anyone: the workflow refuses the move (400) whoever asks.
        ["/api/v1/proposals/{id:int}/withdrawals"] = new("POST", "/api/v1/proposals/{proposal}/withdrawals", ["401", "404", "403", "404", "403"],
            InReview: ["401", "404", "400", "404", "400"], Decided: ["401", "404", "400", "400", "400"]),
        ["/api/v1/proposals/{id:int}/comments"] = new("GET", "/api/v1/proposals/{proposal}/comments", ["401", "404", "200", "404", "200"], Decided: ["401", "404", "200", "200", "200"]),
        ["/api/v1/proposals/{id:int}/comments#POST"] = new("POST", "/api/v1/proposals/{proposal}/comments", ["401", "404", "201", "404", "403"], Decided: ["401", "404", "201", "403", "403"]),
        ["/api/v1/cycles/{id:int}/decisions"] = new("GET", "/api/v1/cycles/{cycle}/decisions", ["401", "200", "200", "200", "200"]),
        // A decision on version 99: a conflict while the proposal awaits its decision, refused once it is decided.
        // Approved while in review, a decision can still be changed: the version judged (99) is then the conflict.
        ["/api/v1/cycles/{id:int}/decisions#POST"] = new("POST", "/api/v1/cycles/{cycle}/decisions", ["401", "403", "409", "403", "403"], Decided: ["401", "403", "400", "403", "403"]),
        ["/api/v1/cycles/{id:int}/decisions/portfolio"] = new("GET", "/api/v1/cycles/{cycle}/decisions/portfolio", ["401", "403", "200", "403", "403"], Decided: ["401", "403", "400", "403", "403"]),
        // The matrix confirms a proposal the selection does not list: a conflict that records nothing.
        ["/api/v1/cycles/{id:int}/decisions/portfolio#POST"] = new("POST", "/api/v1/cycles/{cycle}/decisions/portfolio", ["401", "403", "409", "403", "403"], Decided: ["401", "403", "400", "403", "403"]),
        // Refused in every state: proposals still open, then the cycle already decided.
        ["/api/v1/cycles/{id:int}/sign-offs"] = new("GET", "/api/v1/cycles/{cycle}/sign-offs", ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/sign-offs#POST"] = new("POST", "/api/v1/cycles/{cycle}/sign-offs", ["401", "403", "400", "403", "403"]),
        ["/api/v1/cycles/{id:int}/packet-job"] = new("GET", "/api/v1/cycles/{cycle}/packet-job", ["401", "403", "404", "404", "404"], Decided: ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/packet-job#POST"] = new("POST", "/api/v1/cycles/{cycle}/packet-job", ["401", "403", "400", "400", "400"], Decided: ["401", "403", "202", "202", "202"]),
        ["/api/v1/marr-policies"] = new("GET", "/api/v1/marr-policies", ["401", "200", "200", "200", "200"]),
        ["/api/v1/marr-policies#POST"] = new("POST", "/api/v1/marr-policies", ["401", "403", "403", "403", "400"]),
        ["/api/v1/cycles#POST"] = new("POST", "/api/v1/cycles", ["401", "403", "403", "403", "400"]),
        ["/api/v1/cycles/{id:int}"] = new("GET", "/api/v1/cycles/{cycle}", ["401", "200", "200", "200", "200"]),
        // Closing with revision 0: refused before the cycle is decided, a stale revision once it may be closed.
        ["/api/v1/cycles/{id:int}/status"] = new("PUT", "/api/v1/cycles/{cycle}/status", ["401", "403", "403", "403", "400"], Decided: ["401", "403", "403", "403", "409"]),
        // Administrators' corrections, sent what changes nothing: a version that is not there, a limit of zero, a person who is not there.
        ["/api/v1/marr-policies/{id:int}/retirement"] = new("POST", "/api/v1/marr-policies/999999/retirement", ["401", "403", "403", "403", "404"]),
        ["/api/v1/cycles/{id:int}/terms"] = new("PUT", "/api/v1/cycles/{cycle}/terms", ["401", "403", "403", "403", "400"]),
        ["/api/v1/users"] = new("GET", "/api/v1/users", ["401", "403", "403", "403", "200"]),
        ["/api/v1/users/{id}/roles"] = new("PUT", "/api/v1/users/nobody-here/roles", ["401", "403", "403", "403", "404"]),
        ["/api/v1/audit-events"] = new("GET", "/api/v1/audit-events?from=2027-01-01", ["401", "403", "403", "403", "200"]),
        ["/api/v1/audit-events/csv"] = new("GET", "/api/v1/audit-events/csv", ["401", "403", "403", "403", "200"]),
        ["/api/v1/cycles/{id:int}/portfolio-rules"] = new("GET", "/api/v1/cycles/{cycle}/portfolio-rules", ["401", "403", "200", "403", "200"], Decided: ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/plan"] = new("PUT", "/api/v1/cycles/{cycle}/plan", ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/groups"] = new("POST", "/api/v1/cycles/{cycle}/groups", ["401", "403", "400", "403", "400"]),
        // Removing a group or a contingency that is not there: not found while the rules may change, refused once the cycle is decided.
        ["/api/v1/cycles/{id:int}/groups/{groupId:int}"] = new("DELETE", "/api/v1/cycles/{cycle}/groups/999", ["401", "403", "404", "403", "404"], Decided: ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/contingencies"] = new("POST", "/api/v1/cycles/{cycle}/contingencies", ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/contingencies/{contingencyId:int}"] = new("DELETE", "/api/v1/cycles/{cycle}/contingencies/999", ["401", "403", "404", "403", "404"], Decided: ["401", "403", "400", "403", "400"]),
    };

    /// <summary>
    /// The body each changing route is sent: well-formed, so that what answers is the rule on who may do it (or, for
    /// those allowed, a refusal that changes nothing), not the shape of the request. Other POSTs get the evaluation.
    /// </summary>
    private static readonly Dictionary<string, string> Bodies = new()
    {
        ["/api/v1/proposals"] = """{"title":"Matrix draft","category":"other","riskClass":"standard","assumptions":{"model":{"horizon":2,"elements":[]}}}""",
        ["/api/v1/proposals/{proposal}/versions/1"] = """{"revision":0,"assumptions":{"model":{"horizon":2,"elements":[]}}}""",
        ["/api/v1/proposals/{proposal}/versions"] = """{"revision":0,"reason":"Matrix","assumptions":{"model":{"horizon":2,"elements":[]}}}""",
        ["/api/v1/proposals/{proposal}/submissions"] = """{"cycleId":{cycle},"revision":0}""",
        ["/api/v1/proposals/{proposal}/withdrawals"] = """{"revision":0}""",
        ["/api/v1/proposals/{proposal}/comments"] = """{"text":"Matrix comment"}""",
        ["/api/v1/cycles/{cycle}/decisions"] = """{"proposalId":{proposal},"outcome":"approve","version":99}""",
        ["/api/v1/cycles/{cycle}/decisions/portfolio"] = """{"proposalIds":[999999]}""",
        ["/api/v1/marr-policies"] = """{"rate":-5,"effectiveFrom":"2027-01-01","reason":"Matrix"}""",
        ["/api/v1/cycles"] = """{"name":"","capitalLimit":1,"marrPolicyVersionId":1,"opensOn":"2027-01-01","closesOn":"2027-01-02"}""",
        ["/api/v1/cycles/{cycle}/status"] = """{"status":"closed","revision":0}""",
        ["/api/v1/marr-policies/999999/retirement"] = """{"reason":"Matrix"}""",
        ["/api/v1/cycles/{cycle}/terms"] = """{"capitalLimit":0,"opensOn":"2027-01-01","closesOn":"2027-01-02","revision":0}""",
        ["/api/v1/users/nobody-here/roles"] = """{"roles":["finance"]}""",
        ["/api/v1/cycles/{cycle}/plan"] = """{"studyPeriodYears":0,"revision":0}""",
        ["/api/v1/cycles/{cycle}/groups"] = """{"name":""}""",
        ["/api/v1/cycles/{cycle}/contingencies"] = """{"dependentProposalId":{proposal},"prerequisiteProposalId":{proposal}}""",
    };

    /// <summary>Framework plumbing that is not ours to authorise: the circuit hub and static files.</summary>
    private static bool IsPlumbing(string pattern) =>
        pattern.StartsWith("/_", StringComparison.Ordinal) || pattern.Contains('.', StringComparison.Ordinal) && !pattern.StartsWith("/openapi", StringComparison.Ordinal)
        || pattern.StartsWith("/Components", StringComparison.Ordinal) || pattern.Contains(":file", StringComparison.Ordinal);

    [Fact]
    public void Every_route_of_the_app_has_a_rule()
    {
        var patterns = app.Factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
            .Select(e => (Pattern: "/" + e.RoutePattern.RawText?.TrimStart('/'), Methods: e.Metadata.GetMetadata<HttpMethodMetadata>()?.HttpMethods ?? []))
            .Where(e => !IsPlumbing(e.Pattern))
            .SelectMany(e => e.Methods.Count == 0 ? [e.Pattern] : e.Methods.Select(m => Key(e.Pattern, m)))
            .Distinct()
            .ToList();
        var unknown = patterns.Where(p => !Rules.ContainsKey(p)).ToList();
        Assert.True(unknown.Count == 0, "Routes without an authorisation rule: " + string.Join(", ", unknown));
        Assert.All(Rules.Keys, key => Assert.Contains(key, patterns));
    }

    /// <summary>
    /// A route's key in <see cref="Rules"/>: its pattern where the rule without '#' is for this method, else the
    /// pattern and '#' and the method. An API route's second method needs a rule of its own; a page's form post (the
    /// same pattern as its GET) is answered by the antiforgery check, which
    /// <see cref="Every_form_a_page_renders_carries_an_antiforgery_token_and_is_refused_without_it"/> tests.
    /// </summary>
    private static string Key(string pattern, string method) =>
        Rules.TryGetValue(pattern, out var rule) && (rule.Method == method || (!pattern.StartsWith("/api", StringComparison.Ordinal) && method == "POST"))
            ? pattern
            : pattern + "#" + method;

    public static TheoryData<string, string, CycleStatus> Cases()
    {
        var data = new TheoryData<string, string, CycleStatus>();
        foreach (CycleStatus state in States)
        {
            foreach (string route in Rules.Keys)
            {
                foreach (string who in Who)
                {
                    data.Add(route, who, state);
                }
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public async Task Each_visitor_gets_the_expected_answer(string route, string who, CycleStatus state)
    {
        Rule rule = Rules[route];
        MatrixCycle cycle = app[state];
        string expect = rule.In(state)[Array.IndexOf(Who, who)];
        using HttpClient client = await app.ClientAsync(who == Anonymous ? null : who);
        using var request = new HttpRequestMessage(new HttpMethod(rule.Method), cycle.Resolve(rule.Path));
        if (rule.Method is "POST" or "PUT")
        {
            bool api = rule.Path.StartsWith("/api", StringComparison.Ordinal);
            request.Content = new StringContent(api ? cycle.Resolve(Bodies.GetValueOrDefault(rule.Path, Evaluation)) : "", Encoding.UTF8,
                api ? "application/json" : "application/x-www-form-urlencoded");
        }
        using HttpResponseMessage response = await client.SendAsync(request);
        Assert.Equal(expect, await OutcomeAsync(response));
    }

    private static async Task<string> OutcomeAsync(HttpResponseMessage response) => response.StatusCode switch
    {
        HttpStatusCode.Redirect or HttpStatusCode.Found when response.Headers.Location!.OriginalString.Contains("/signin", StringComparison.Ordinal) => "signin",
        HttpStatusCode.Redirect or HttpStatusCode.Found when response.Headers.Location!.OriginalString.Contains("/denied", StringComparison.Ordinal) => "denied",
        HttpStatusCode.OK when response.Content.Headers.ContentType?.MediaType == "text/html"
            && (await response.Content.ReadAsStringAsync()).Contains("data-testid=\"not-yet\"", StringComparison.Ordinal) => "not-yet",
        var status => ((int)status).ToString(System.Globalization.CultureInfo.InvariantCulture),
    };

    // The downloads with a personal API token instead of the cookie, per role (lead, board, finance, administrator)
    // and state: the same rules (a token is refused with 403 where the cookie is sent to the not-for-your-role page).
    private static readonly Dictionary<string, (string[] Open, string[] Decided)> TokenDownloads = new()
    {
        ["/cycles/{cycle}/ranking/csv"] = (["403", "200", "403", "200"], ["403", "200", "200", "200"]),
        ["/cycles/{cycle}/ranking/xlsx?shift=1"] = (["403", "200", "403", "200"], ["403", "200", "200", "200"]),
        ["/cycles/{cycle}/portfolio/csv?objective=annualWorth"] = (["403", "200", "403", "200"], ["403", "200", "200", "200"]),
        ["/cycles/{cycle}/portfolio/xlsx"] = (["403", "200", "403", "200"], ["403", "200", "200", "200"]),
        ["/proposals/{proposal}/versions/1/xlsx"] = (["404", "200", "404", "200"], ["404", "200", "200", "200"]),
        ["/proposals/{proposal}/versions/1/csv/elements"] = (["404", "200", "404", "200"], ["404", "200", "200", "200"]),
    };

    public static TheoryData<string, string, CycleStatus> TokenCases()
    {
        var data = new TheoryData<string, string, CycleStatus>();
        foreach (CycleStatus state in States)
        {
            foreach (string path in TokenDownloads.Keys)
            {
                foreach (string who in Who.Skip(1))
                {
                    data.Add(path, who, state);
                }
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(TokenCases))]
    public async Task Every_download_answers_an_api_token_by_the_same_role_rules(string path, string who, CycleStatus state)
    {
        var (open, decided) = TokenDownloads[path];
        string expect = (state == CycleStatus.Decided ? decided : open)[Array.IndexOf(Who, who) - 1];
        var (client, _) = await app.Factory.TokenClientAsync($"matrix.token.{who.ToLowerInvariant()}@tarnby.example", who);
        using (client)
        {
            using HttpResponseMessage response = await client.GetAsync(app[state].Resolve(path));
            Assert.Equal(expect, ((int)response.StatusCode).ToString(System.Globalization.CultureInfo.InvariantCulture));
            if (expect == "200")
            {
                Assert.True((await response.Content.ReadAsByteArrayAsync()).Length > 0);
            }
        }
    }

    public static TheoryData<string, string, CycleStatus> BadTokenCases()
    {
        var data = new TheoryData<string, string, CycleStatus>();
        foreach (CycleStatus state in States)
        {
            // Every route a visitor must be signed in for: the API, the downloads, the pages and the OpenAPI document.
            foreach (string route in Rules.Keys.Where(r => Rules[r].Open[0] is "401" or "signin"))
            {
                foreach (string kind in new[] { "never issued", "not a token", "revoked", "of a disabled account" })
                {
                    data.Add(route, kind, state);
                }
            }
        }
        return data;
    }

    /// <summary>
    /// A token that is not (or no longer) valid gets 401 on every route that needs a signed-in caller, every /api/v1
    /// route among them, before anything else is looked at: never a page, a redirect to the sign-in or a 403.
    /// </summary>
    [Theory]
    [MemberData(nameof(BadTokenCases))]
    public async Task Every_route_answers_a_token_that_is_not_valid_with_401(string route, string kind, CycleStatus state)
    {
        Rule rule = Rules[route];
        MatrixCycle cycle = app[state];
        string token = (await app.BadTokensAsync())[kind];
        using HttpClient client = await app.ClientAsync(null);
        using var request = new HttpRequestMessage(new HttpMethod(rule.Method), cycle.Resolve(rule.Path));
        request.Headers.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", token);
        if (rule.Method is "POST" or "PUT")
        {
            bool api = rule.Path.StartsWith("/api", StringComparison.Ordinal);
            request.Content = new StringContent(api ? cycle.Resolve(Bodies.GetValueOrDefault(rule.Path, Evaluation)) : "", Encoding.UTF8,
                api ? "application/json" : "application/x-www-form-urlencoded");
        }
        using HttpResponseMessage response = await client.SendAsync(request);
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
    }

    [Fact]
    public async Task A_download_without_a_cookie_or_a_valid_token_is_refused()
    {
        using HttpClient client = await app.ClientAsync(null);
        client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", "crv_not-a-token");
        using HttpResponseMessage response = await client.GetAsync(app[CycleStatus.Decided].Resolve("/cycles/{cycle}/ranking/csv"));
        Assert.NotEqual(HttpStatusCode.OK, response.StatusCode);
        Assert.False(response.Content.Headers.ContentType?.MediaType == "text/csv");
    }

    /// <summary>
    /// Every form any page renders for any visitor posts with an antiforgery token (the interactive pages' forms post
    /// nothing: they run over the circuit), and the forms that post are refused without it. Every page a signed-in
    /// visitor sees offers the sign-out.
    /// </summary>
    [Fact]
    public async Task Every_form_a_page_renders_carries_an_antiforgery_token_and_is_refused_without_it()
    {
        int forms = 0;
        foreach (CycleStatus state in States)
        {
            foreach (string who in Who)
            {
                using HttpClient client = await app.ClientAsync(who == Anonymous ? null : who);
                foreach (Rule rule in Rules.Values.Where(r => r.Method == "GET" && !r.Path.StartsWith("/api", StringComparison.Ordinal)))
                {
                    string path = app[state].Resolve(rule.Path);
                    using HttpResponseMessage page = await client.GetAsync(path);
                    if (page.Content.Headers.ContentType?.MediaType != "text/html")
                    {
                        continue;
                    }
                    string html = await page.Content.ReadAsStringAsync();
                    if (who != Anonymous)
                    {
                        Assert.Contains("action=\"signout\"", html, StringComparison.Ordinal);
                    }
                    foreach (Match form in FormElement().Matches(html))
                    {
                        forms++;
                        Assert.True(form.Groups["attributes"].Value.Contains("method=\"post\"", StringComparison.OrdinalIgnoreCase),
                            $"{path} as {who} renders a form that does not post: {form.Value[..Math.Min(200, form.Value.Length)]}");
                        Assert.Contains("name=\"__RequestVerificationToken\"", form.Value, StringComparison.Ordinal);
                    }
                }
            }
        }
        // At least the sign-in form (everyone) and the sign-out form (everyone signed in).
        Assert.True(forms >= 5, $"only {forms} forms were found");

        using HttpClient anonymous = await app.ClientAsync(null);
        using var withoutToken = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["_handler"] = "signin", ["Input.Email"] = "matrix.administrator@tarnby.example", ["Input.Password"] = MatrixApp.Password,
        });
        using HttpResponseMessage refused = await anonymous.PostAsync("/signin", withoutToken);
        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        Assert.False(refused.Headers.Contains("Set-Cookie") && refused.Headers.GetValues("Set-Cookie").Any(c => c.StartsWith("capreview=", StringComparison.Ordinal)));
    }

    [GeneratedRegex("<form(?<attributes>[^>]*)>.*?</form>", RegexOptions.Singleline | RegexOptions.IgnoreCase)]
    private static partial Regex FormElement();
}
