using System.Net;
using System.Text;
using System.Text.RegularExpressions;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// Every page route and endpoint of the app against anonymous visitors and every role, from one table. A route the
/// table does not know fails the test, so a new endpoint cannot arrive without its rule.
/// </summary>
public sealed partial class AuthorizationMatrix(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Anonymous = "anonymous";
    private static readonly string[] Who = [Anonymous, RoleNames.ProjectLead, RoleNames.Reviewer, RoleNames.Finance, RoleNames.Administrator];

    private const string Evaluation = """{"horizon":2,"rate":{"value":0.1},"elements":[{"type":"single","label":"a","category":"capital","period":0,"amount":-100},{"type":"uniform","label":"b","category":"revenue","first":1,"last":2,"amount":60}]}""";

    // Expected outcome per visitor: 200 shown, 401 refused (API), "signin" redirected to the sign-in form, "denied"
    // redirected to the not-for-your-role page, 400 refused for want of an antiforgery token, 404 not theirs to see
    // (finance sees a proposal once it is decided).
    private static readonly Dictionary<string, (string Method, string Path, string[] Expected)> Rules = new()
    {
        ["/"] = ("GET", "/", ["200", "200", "200", "200", "200"]),
        ["/signin"] = ("GET", "/signin", ["200", "200", "200", "200", "200"]),
        ["/denied"] = ("GET", "/denied", ["200", "200", "200", "200", "200"]),
        ["/account"] = ("GET", "/account", ["signin", "200", "200", "200", "200"]),
        ["/not-found"] = ("GET", "/not-found", ["200", "200", "200", "200", "200"]),
        ["/error"] = ("GET", "/error", ["200", "200", "200", "200", "200"]),
        ["/evaluate"] = ("GET", "/evaluate", ["signin", "200", "200", "200", "200"]),
        ["/proposals"] = ("GET", "/proposals", ["signin", "200", "denied", "denied", "denied"]),
        ["/proposals/new"] = ("GET", "/proposals/new", ["signin", "200", "200", "200", "200"]),
        ["/proposals/{Id:int}"] = ("GET", "/proposals/1", ["signin", "200", "200", "200", "200"]),
        ["/cycles"] = ("GET", "/cycles", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}"] = ("GET", "/cycles/1", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}/ranking"] = ("GET", "/cycles/1/ranking", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{Id:int}/portfolio"] = ("GET", "/cycles/1/portfolio", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{id:int}/ranking/{format:regex(^(csv|xlsx)$)}"] = ("GET", "/cycles/1/ranking/csv", ["signin", "denied", "200", "200", "200"]),
        ["/cycles/{id:int}/portfolio/{format:regex(^(csv|xlsx)$)}"] = ("GET", "/cycles/1/portfolio/xlsx", ["signin", "denied", "200", "200", "200"]),
        ["/packets/{id:int}"] = ("GET", "/packets/1", ["signin", "404", "404", "404", "404"]),
        ["/proposals/{id:int}/versions/{number:int}/xlsx"] = ("GET", "/proposals/1/versions/1/xlsx", ["signin", "404", "200", "404", "200"]),
        ["/proposals/{id:int}/versions/{number:int}/csv/{table}"] = ("GET", "/proposals/1/versions/1/csv/elements", ["signin", "404", "200", "404", "200"]),
        ["/proposals/{Id:int}/replacement"] = ("GET", "/proposals/1/replacement", ["signin", "200", "200", "200", "200"]),
        ["/admin/users"] = ("GET", "/admin/users", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/marr"] = ("GET", "/admin/marr", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/cycles"] = ("GET", "/admin/cycles", ["signin", "denied", "denied", "denied", "200"]),
        ["/admin/audit"] = ("GET", "/admin/audit", ["signin", "denied", "denied", "denied", "200"]),
        ["/api/v1/evaluations"] = ("POST", "/api/v1/evaluations", ["401", "200", "200", "200", "200"]),
        // The matrix posts an evaluation body: signed in, the risk analysis refuses it for want of its model and risk settings.
        ["/api/v1/risk-analyses"] = ("POST", "/api/v1/risk-analyses", ["401", "400", "400", "400", "400"]),
        ["/api/v1/cycles"] = ("GET", "/api/v1/cycles", ["401", "200", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/ranking"] = ("GET", "/api/v1/cycles/1/ranking", ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/portfolio"] = ("GET", "/api/v1/cycles/1/portfolio?limit=500000&objective=annualWorth", ["401", "403", "200", "200", "200"]),
        // Proposal 1 is in an exclusive group of cycle 1 and has no replacement estimates (400 for those who may see it).
        ["/api/v1/proposals/{id:int}/versions/{number:int}/incremental"] = ("GET", "/api/v1/proposals/1/versions/1/incremental", ["401", "404", "200", "404", "200"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}/replacement"] = ("GET", "/api/v1/proposals/1/versions/1/replacement", ["401", "404", "400", "404", "400"]),
        ["/api/v1/proposals"] = ("GET", "/api/v1/proposals", ["401", "200", "200", "200", "200"]),
        ["/api/v1/proposals/{id:int}"] = ("GET", "/api/v1/proposals/1", ["401", "404", "200", "404", "200"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}"] = ("GET", "/api/v1/proposals/1/versions/1", ["401", "404", "200", "404", "200"]),
        ["/api/v1/cycles/{id:int}/packets"] = ("GET", "/api/v1/cycles/1/packets", ["401", "200", "200", "200", "200"]),
        ["/api/v1/packets/{id:int}"] = ("GET", "/api/v1/packets/1", ["401", "404", "404", "404", "404"]),
        ["/api/v1/cycles/{id:int}/document"] = ("GET", "/api/v1/cycles/1/document", ["401", "403", "200", "403", "200"]),
        ["/api/v1/cycles/{id:int}/document/signed"] = ("GET", "/api/v1/cycles/1/document/signed", ["401", "403", "200", "403", "200"]),
        ["/api/v1/cycles/import"] = ("POST", "/api/v1/cycles/import", ["401", "403", "403", "403", "400"]),
        ["/openapi/{documentName}.json"] = ("GET", "/openapi/v1.json", ["401", "200", "200", "200", "200"]),
        ["/health/live"] = ("GET", "/health/live", ["200", "200", "200", "200", "200"]),
        ["/health/ready"] = ("GET", "/health/ready", ["200", "200", "200", "200", "200"]),
        ["/signout"] = ("POST", "/signout", ["400", "400", "400", "400", "400"]),
        ["/api/v1/proposals/{id:int}/versions/{number:int}#PUT"] = ("PUT", "/api/v1/proposals/1/versions/1", ["401", "404", "403", "404", "403"]),
        ["/api/v1/proposals/{id:int}/versions"] = ("POST", "/api/v1/proposals/1/versions", ["401", "404", "403", "404", "403"]),
        ["/api/v1/proposals/{id:int}/submissions"] = ("POST", "/api/v1/proposals/1/submissions", ["401", "404", "403", "404", "403"]),
        ["/api/v1/proposals/{id:int}/withdrawals"] = ("POST", "/api/v1/proposals/1/withdrawals", ["401", "404", "403", "404", "403"]),
        ["/api/v1/proposals/{id:int}/comments"] = ("GET", "/api/v1/proposals/1/comments", ["401", "404", "200", "404", "200"]),
        ["/api/v1/proposals/{id:int}/comments#POST"] = ("POST", "/api/v1/proposals/1/comments", ["401", "404", "201", "404", "403"]),
        ["/api/v1/cycles/{id:int}/decisions"] = ("GET", "/api/v1/cycles/1/decisions", ["401", "200", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/decisions#POST"] = ("POST", "/api/v1/cycles/1/decisions", ["401", "403", "409", "403", "403"]),
        ["/api/v1/cycles/{id:int}/sign-offs"] = ("GET", "/api/v1/cycles/1/sign-offs", ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/sign-offs#POST"] = ("POST", "/api/v1/cycles/1/sign-offs", ["401", "403", "400", "403", "403"]),
        ["/api/v1/cycles/{id:int}/packet-job"] = ("GET", "/api/v1/cycles/1/packet-job", ["401", "403", "404", "404", "404"]),
        ["/api/v1/cycles/{id:int}/packet-job#POST"] = ("POST", "/api/v1/cycles/1/packet-job", ["401", "403", "400", "400", "400"]),
        ["/api/v1/marr-policies"] = ("GET", "/api/v1/marr-policies", ["401", "200", "200", "200", "200"]),
        ["/api/v1/marr-policies#POST"] = ("POST", "/api/v1/marr-policies", ["401", "403", "403", "403", "400"]),
        ["/api/v1/cycles#POST"] = ("POST", "/api/v1/cycles", ["401", "403", "403", "403", "400"]),
        ["/api/v1/cycles/{id:int}"] = ("GET", "/api/v1/cycles/1", ["401", "200", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/status"] = ("PUT", "/api/v1/cycles/1/status", ["401", "403", "403", "403", "400"]),
        ["/api/v1/cycles/{id:int}/portfolio-rules"] = ("GET", "/api/v1/cycles/1/portfolio-rules", ["401", "403", "200", "200", "200"]),
        ["/api/v1/cycles/{id:int}/plan"] = ("PUT", "/api/v1/cycles/1/plan", ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/groups"] = ("POST", "/api/v1/cycles/1/groups", ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/groups/{groupId:int}"] = ("DELETE", "/api/v1/cycles/1/groups/999", ["401", "403", "404", "403", "404"]),
        ["/api/v1/cycles/{id:int}/contingencies"] = ("POST", "/api/v1/cycles/1/contingencies", ["401", "403", "400", "403", "400"]),
        ["/api/v1/cycles/{id:int}/contingencies/{contingencyId:int}"] = ("DELETE", "/api/v1/cycles/1/contingencies/999", ["401", "403", "404", "403", "404"]),
    };

    /// <summary>
    /// The body each changing route is sent: well-formed, so that what answers is the rule on who may do it (or, for
    /// those allowed, a refusal that changes nothing), not the shape of the request. Other POSTs get the evaluation.
    /// </summary>
    private static readonly Dictionary<string, string> Bodies = new()
    {
        ["/api/v1/proposals/1/versions/1"] = """{"revision":0,"assumptions":{"model":{"horizon":2,"elements":[]}}}""",
        ["/api/v1/proposals/1/versions"] = """{"revision":0,"reason":"Matrix","assumptions":{"model":{"horizon":2,"elements":[]}}}""",
        ["/api/v1/proposals/1/submissions"] = """{"cycleId":1,"revision":0}""",
        ["/api/v1/proposals/1/withdrawals"] = """{"revision":0}""",
        ["/api/v1/proposals/1/comments"] = """{"text":"Matrix comment"}""",
        ["/api/v1/cycles/1/decisions"] = """{"proposalId":1,"outcome":"approve","version":99}""",
        ["/api/v1/marr-policies"] = """{"rate":-5,"effectiveFrom":"2027-01-01","reason":"Matrix"}""",
        ["/api/v1/cycles"] = """{"name":"","capitalLimit":1,"marrPolicyVersionId":1,"opensOn":"2027-01-01","closesOn":"2027-01-02"}""",
        ["/api/v1/cycles/1/status"] = """{"status":"closed","revision":0}""",
        ["/api/v1/cycles/1/plan"] = """{"studyPeriodYears":0,"revision":0}""",
        ["/api/v1/cycles/1/groups"] = """{"name":""}""",
        ["/api/v1/cycles/1/contingencies"] = """{"dependentProposalId":1,"prerequisiteProposalId":1}""",
    };

    /// <summary>Framework plumbing that is not ours to authorise: the circuit hub and static files.</summary>
    private static bool IsPlumbing(string pattern) =>
        pattern.StartsWith("/_", StringComparison.Ordinal) || pattern.Contains('.', StringComparison.Ordinal) && !pattern.StartsWith("/openapi", StringComparison.Ordinal)
        || pattern.StartsWith("/Components", StringComparison.Ordinal) || pattern.Contains(":file", StringComparison.Ordinal);

    [Fact]
    public void Every_route_of_the_app_has_a_rule()
    {
        var patterns = factory.Services.GetRequiredService<EndpointDataSource>().Endpoints.OfType<RouteEndpoint>()
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
    /// A route's key in <see cref="Rules"/>: its pattern, or the pattern and '#' and the method where one pattern
    /// serves several methods (the rule without '#' is for the method it names).
    /// </summary>
    private static string Key(string pattern, string method) =>
        Rules.TryGetValue(pattern, out var rule) && rule.Method == method ? pattern : Rules.ContainsKey(pattern + "#" + method) ? pattern + "#" + method : pattern;

    public static TheoryData<string, string> Cases()
    {
        var data = new TheoryData<string, string>();
        foreach (string route in Rules.Keys)
        {
            foreach (string who in Who)
            {
                data.Add(route, who);
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public async Task Each_visitor_gets_the_expected_answer(string route, string who)
    {
        await EnsureCycleAsync();
        var (method, path, expected) = Rules[route];
        string expect = expected[Array.IndexOf(Who, who)];
        using HttpClient client = who == Anonymous ? NewClient() : await SignedInClientAsync(who);
        using var request = new HttpRequestMessage(new HttpMethod(method), path);
        if (method is "POST" or "PUT")
        {
            request.Content = new StringContent(path.StartsWith("/api", StringComparison.Ordinal) ? Bodies.GetValueOrDefault(path, Evaluation) : "", Encoding.UTF8,
                path.StartsWith("/api", StringComparison.Ordinal) ? "application/json" : "application/x-www-form-urlencoded");
        }
        using HttpResponseMessage response = await client.SendAsync(request);
        string actual = response.StatusCode switch
        {
            HttpStatusCode.Redirect or HttpStatusCode.Found when response.Headers.Location!.OriginalString.Contains("/signin", StringComparison.Ordinal) => "signin",
            HttpStatusCode.Redirect or HttpStatusCode.Found when response.Headers.Location!.OriginalString.Contains("/denied", StringComparison.Ordinal) => "denied",
            var status => ((int)status).ToString(System.Globalization.CultureInfo.InvariantCulture),
        };
        Assert.Equal(expect, actual);
    }

    // The downloads with a personal API token instead of the cookie, per role: the same rules (a token is refused with
    // 403 where the cookie is sent to the not-for-your-role page).
    private static readonly Dictionary<string, string[]> TokenDownloads = new()
    {
        ["/cycles/1/ranking/csv"] = ["403", "200", "200", "200"],
        ["/cycles/1/ranking/xlsx?shift=1"] = ["403", "200", "200", "200"],
        ["/cycles/1/portfolio/csv?objective=annualWorth"] = ["403", "200", "200", "200"],
        ["/cycles/1/portfolio/xlsx"] = ["403", "200", "200", "200"],
        ["/proposals/1/versions/1/xlsx"] = ["404", "200", "404", "200"],
        ["/proposals/1/versions/1/csv/elements"] = ["404", "200", "404", "200"],
    };

    public static TheoryData<string, string> TokenCases()
    {
        var data = new TheoryData<string, string>();
        foreach (string path in TokenDownloads.Keys)
        {
            foreach (string who in Who.Skip(1))
            {
                data.Add(path, who);
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(TokenCases))]
    public async Task Every_download_answers_an_api_token_by_the_same_role_rules(string path, string who)
    {
        await EnsureCycleAsync();
        string expect = TokenDownloads[path][Array.IndexOf(Who, who) - 1];
        var (client, _) = await factory.TokenClientAsync($"matrix.token.{who.ToLowerInvariant()}@tarnby.example", who);
        using (client)
        {
            using HttpResponseMessage response = await client.GetAsync(path);
            Assert.Equal(expect, ((int)response.StatusCode).ToString(System.Globalization.CultureInfo.InvariantCulture));
            if (expect == "200")
            {
                Assert.True((await response.Content.ReadAsByteArrayAsync()).Length > 0);
            }
        }
    }

    [Fact]
    public async Task A_download_without_a_cookie_or_a_valid_token_is_refused()
    {
        await EnsureCycleAsync();
        using HttpClient client = NewClient();
        client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", "crv_not-a-token");
        using HttpResponseMessage response = await client.GetAsync("/cycles/1/ranking/csv");
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
        await EnsureCycleAsync();
        int forms = 0;
        foreach (string who in Who)
        {
            using HttpClient client = who == Anonymous ? NewClient() : await SignedInClientAsync(who);
            foreach (var (method, path, _) in Rules.Values.Where(r => r.Method == "GET" && !r.Path.StartsWith("/api", StringComparison.Ordinal)))
            {
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
        // At least the sign-in form (everyone) and the sign-out form (everyone signed in).
        Assert.True(forms >= 5, $"only {forms} forms were found");

        using HttpClient anonymous = NewClient();
        using var withoutToken = new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["_handler"] = "signin", ["Input.Email"] = "matrix.administrator@tarnby.example", ["Input.Password"] = "matrix-tests-2027",
        });
        using HttpResponseMessage refused = await anonymous.PostAsync("/signin", withoutToken);
        Assert.Equal(HttpStatusCode.BadRequest, refused.StatusCode);
        Assert.False(refused.Headers.Contains("Set-Cookie") && refused.Headers.GetValues("Set-Cookie").Any(c => c.StartsWith("capreview=", StringComparison.Ordinal)));
    }

    [GeneratedRegex("<form(?<attributes>[^>]*)>.*?</form>", RegexOptions.Singleline | RegexOptions.IgnoreCase)]
    private static partial Regex FormElement();

    private static readonly SemaphoreSlim CycleLock = new(1, 1);

    /// <summary>
    /// Cycle 1 exists with proposal 1 submitted to it by a lead other than the matrix's, so that the cycle's and the
    /// proposal's pages and downloads answer for the roles allowed to see them, and the matrix's lead finds no such proposal.
    /// </summary>
    private async Task EnsureCycleAsync()
    {
        await CycleLock.WaitAsync();
        try
        {
            var cycles = factory.Services.GetRequiredService<CapReview.Reviews.Cycles.CycleService>();
            if ((await cycles.ListAsync(CancellationToken.None)).Count > 0)
            {
                return;
            }
            var admin = CapReview.Reviews.Access.Actor.Of("matrix-setup", "Matrix setup", CapReview.Reviews.Access.Role.Administrator);
            var marr = await factory.Services.GetRequiredService<CapReview.Reviews.Marr.MarrPolicyService>().AddVersionAsync(admin,
                new CapReview.Reviews.Marr.NewMarrPolicy(0.08, CapReview.Engine.Rates.RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Matrix policy"), CancellationToken.None);
            var cycle = await cycles.CreateAsync(admin, new CapReview.Reviews.Cycles.NewBudgetCycle("Matrix cycle", 1_000_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
            var owner = CapReview.Reviews.Access.Actor.Of("matrix-owner", "Matrix owner", CapReview.Reviews.Access.Role.ProjectLead);
            var proposals = factory.Services.GetRequiredService<CapReview.Reviews.Proposals.ProposalService>();
            var written = new CapReview.Reviews.Proposals.ProposalDraft("Matrix proposal", "", CapReview.Reviews.Proposals.ProposalCategory.Other,
                CapReview.Reviews.Proposals.RiskClass.Standard, new CapReview.Reviews.Proposals.ProposalAssumptions
                {
                    Model = new CapReview.Engine.Specifications.ModelSpec
                    {
                        Horizon = 2,
                        Elements =
                        [
                            new CapReview.Engine.Specifications.ElementSpec { Type = CapReview.Engine.Specifications.ElementKind.Single, Label = "a", Category = CapReview.Engine.CashFlows.CashFlowCategory.Capital, Period = 0, Amount = -100 },
                            new CapReview.Engine.Specifications.ElementSpec { Type = CapReview.Engine.Specifications.ElementKind.Uniform, Label = "b", Category = CapReview.Engine.CashFlows.CashFlowCategory.Revenue, First = 1, Last = 2, Amount = 60 },
                        ],
                    },
                }, null);
            var draft = await proposals.CreateDraftAsync(owner, written, CancellationToken.None);
            await proposals.SubmitAsync(owner, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);
            var other = await proposals.CreateDraftAsync(owner, written with { Title = "Matrix alternative" }, CancellationToken.None);
            await proposals.SubmitAsync(owner, other.Id, cycle.Id, other.Revision, CancellationToken.None);
            await factory.Services.GetRequiredService<CapReview.Reviews.Portfolio.PortfolioRulesService>().SaveGroupAsync(admin, cycle.Id,
                new CapReview.Reviews.Portfolio.GroupDraft("Matrix group", false, [draft.Id, other.Id]), CancellationToken.None);
        }
        finally
        {
            CycleLock.Release();
        }
    }

    private HttpClient NewClient() => factory.CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });

    /// <summary>Signs in through the real form, as a browser would, and keeps the cookie.</summary>
    private async Task<HttpClient> SignedInClientAsync(string role)
    {
        string email = $"matrix.{role.ToLowerInvariant()}@tarnby.example";
        using (var scope = factory.Services.CreateScope())
        {
            var identity = scope.ServiceProvider.GetRequiredService<IdentityStore>();
            if (await identity.FindByEmailAsync(email) is null)
            {
                await identity.CreateUserAsync(email, $"Matrix {role}", "matrix-tests-2027", [role]);
            }
        }
        HttpClient client = NewClient();
        using HttpResponseMessage signedIn = await FormSignIn.PostAsync(client, email, "matrix-tests-2027");
        Assert.True(signedIn.StatusCode is HttpStatusCode.Redirect or HttpStatusCode.Found, $"sign-in as {role} answered {signedIn.StatusCode}");
        return client;
    }
}
