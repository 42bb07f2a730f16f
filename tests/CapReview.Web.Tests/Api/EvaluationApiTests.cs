using Microsoft.Extensions.DependencyInjection;
using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Api;

public sealed class EvaluationApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string Example = """
        {"periodsPerYear": 1, "horizon": 10, "rate": {"value": 0.10, "basis": "effective"},
         "elements": [
           {"type": "single", "label": "Press brake", "category": "capital", "period": 0, "amount": -10000},
           {"type": "uniform", "label": "Labour saved", "category": "revenue", "first": 1, "last": 10, "amount": 2000},
           {"type": "arithmetic", "label": "Upkeep", "category": "operating", "first": 1, "last": 10, "amount": -100, "step": -10},
           {"type": "geometric", "label": "Scrap resale", "category": "revenue", "first": 1, "last": 10, "amount": 150, "growth": 0.03},
           {"type": "recurring", "label": "Tooling refit", "category": "capital", "first": 4, "last": 8, "every": 4, "amount": -600}
         ]}
        """;

    private async Task<(HttpStatusCode Status, JsonElement Body, string? MediaType)> PostAsync(string json)
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        using var content = new StringContent(json, Encoding.UTF8, "application/json");
        using HttpResponseMessage response = await client.PostAsync("/api/v1/evaluations", content);
        string text = await response.Content.ReadAsStringAsync();
        return (response.StatusCode, JsonDocument.Parse(text).RootElement.Clone(), response.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task The_empty_model_has_no_payback()
    {
        var (status, body, _) = await PostAsync("""
            {"periodsPerYear": 1, "horizon": 5, "rate": {"value": 0.10, "basis": "effective"},
             "elements": [ {"type": "single", "label": "First cost", "category": "capital", "period": 0, "amount": 0} ]}
            """);
        Assert.Equal(HttpStatusCode.OK, status);
        JsonElement payback = body.GetProperty("payback");
        Assert.Equal(JsonValueKind.Null, payback.GetProperty("simpleYears").ValueKind);
        Assert.Equal(JsonValueKind.Null, payback.GetProperty("discountedYears").ValueKind);
        Assert.Equal(JsonValueKind.Null, payback.GetProperty("simple").ValueKind);
    }

    [Fact]
    public async Task Invalid_input_keeps_each_fields_path_for_programs_and_names_it_in_words_for_people()
    {
        var (status, body, _) = await PostAsync("""
            {"horizon": 6, "rate": {"value": 0.08}, "elements": [
              {"type": "uniform", "label": "Hire", "category": "revenue", "first": 4, "last": 9, "amount": 11500},
              {"type": "single", "label": "Press", "category": "capital", "period": 0, "amount": -1000},
              {"type": "geometric", "label": "Energy", "category": "revenue", "first": 1, "last": 6, "amount": 500, "growth": -1.5}
            ]}
            """);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        JsonElement errors = body.GetProperty("errors");
        Assert.True(errors.TryGetProperty("elements[0].last", out _));
        Assert.True(errors.TryGetProperty("elements[2].growth", out _));
        string detail = body.GetProperty("detail").GetString()!;
        Assert.StartsWith("Element 1, last period: ", detail, StringComparison.Ordinal);
        Assert.Contains("Element 3, growth per period: ", detail, StringComparison.Ordinal);
        Assert.DoesNotContain("elements[", detail, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Evaluates_a_model_and_matches_VisualBasic_Financial()
    {
        var (status, body, _) = await PostAsync(Example);
        Assert.Equal(HttpStatusCode.OK, status);
        double[] flows = body.GetProperty("netFlows").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.Equal(11, flows.Length);
        Assert.Equal(-10000, flows[0]);
        Assert.Equal(2000 + (-100 - 3 * 10) + 150 * Math.Pow(1.03, 3) - 600, flows[4], 9);

        double[] later = flows.Skip(1).ToArray();
        double pw = flows[0] + Financial.NPV(0.10, ref later);
        Assert.Equal(pw, body.GetProperty("presentWorth").GetDouble(), 8);
        Assert.Equal(-Financial.Pmt(0.10, 10, pw), body.GetProperty("annualWorth").GetDouble(), 8);
        Assert.Equal(-Financial.FV(0.10, 10, 0, pw), body.GetProperty("futureWorth").GetDouble(), 7);

        JsonElement ror = body.GetProperty("rateOfReturn");
        double[] copy = [.. flows];
        Assert.Equal(Financial.IRR(ref copy, 0.1), ror.GetProperty("roots")[0].GetDouble(), 9);
        Assert.True(ror.GetProperty("unique").GetBoolean());
        Assert.Equal(1, ror.GetProperty("signChanges").GetInt32());
        copy = [.. flows];
        Assert.Equal(Financial.MIRR(ref copy, 0.10, 0.10), body.GetProperty("externalRate").GetDouble(), 12);
        Assert.True(body.GetProperty("payback").GetProperty("simple").GetDouble() > 5);
        Assert.True(body.GetProperty("benefitCostRatio").GetProperty("conventional").GetDouble() > 1);
    }

    [Fact]
    public async Task Stores_nothing()
    {
        using (HttpClient warm = factory.CreateClient())
        {
            await warm.GetAsync("/");
        }
        var before = await RowCountsAsync();
        var (status, _, _) = await PostAsync(Example);
        Assert.Equal(HttpStatusCode.OK, status);
        Assert.Equal(before, await RowCountsAsync());
        Assert.Contains("audit_event", before.Keys);
    }

    /// <summary>The number of rows in every table of the app's database (both contexts' tables, on either provider).</summary>
    private async Task<Dictionary<string, long>> RowCountsAsync()
    {
        var counts = new Dictionary<string, long>();
        await using var domain = await factory.Services.GetRequiredService<Microsoft.EntityFrameworkCore.IDbContextFactory<CapReview.Reviews.Storage.CapReviewDbContext>>().CreateDbContextAsync();
        await using var identity = await factory.Services.GetRequiredService<Microsoft.EntityFrameworkCore.IDbContextFactory<CapReview.Web.Identity.CapReviewIdentityDbContext>>().CreateDbContextAsync();
        foreach (Microsoft.EntityFrameworkCore.DbContext db in new Microsoft.EntityFrameworkCore.DbContext[] { domain, identity })
        {
            var connection = Microsoft.EntityFrameworkCore.RelationalDatabaseFacadeExtensions.GetDbConnection(db.Database);
            await connection.OpenAsync();
            foreach (string table in db.Model.GetEntityTypes().Select(Microsoft.EntityFrameworkCore.RelationalEntityTypeExtensions.GetTableName).OfType<string>().Distinct())
            {
                using var count = connection.CreateCommand();
                count.CommandText = $"SELECT COUNT(*) FROM \"{table}\"";
                counts[table] = Convert.ToInt64(await count.ExecuteScalarAsync(), System.Globalization.CultureInfo.InvariantCulture);
            }
        }
        return counts;
    }

    [Fact]
    public async Task Invalid_fields_are_named_in_problem_details()
    {
        var (status, body, mediaType) = await PostAsync("""
            {"horizon": 0, "rate": {"value": 0.1, "basis": "nominal"},
             "elements": [{"type": "uniform", "label": "", "category": "operating", "first": 5, "last": 3, "amount": 1}]}
            """);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.Equal("application/problem+json", mediaType);
        Assert.Equal(400, body.GetProperty("status").GetInt32());
        var fields = body.GetProperty("errors").EnumerateObject().Select(p => p.Name).ToArray();
        Assert.Equal(["rate.compoundingsPerYear", "horizon"], fields);

        (status, body, _) = await PostAsync("""
            {"horizon": 0, "rate": {"value": 0.1},
             "elements": [{"type": "uniform", "label": "", "category": "operating", "first": 5, "last": 3, "amount": 1}]}
            """);
        fields = body.GetProperty("errors").EnumerateObject().Select(p => p.Name).ToArray();
        Assert.Equal(["horizon"], fields);

        (status, body, _) = await PostAsync("""
            {"horizon": 10, "rate": {"value": 0.1},
             "elements": [{"type": "uniform", "label": "", "category": "operating", "first": 5, "last": 3, "amount": 1}]}
            """);
        fields = body.GetProperty("errors").EnumerateObject().Select(p => p.Name).ToArray();
        Assert.Equal(["elements[0].label", "elements[0].last"], fields);
        Assert.Contains("before the first", body.GetProperty("errors").GetProperty("elements[0].last")[0].GetString());
    }

    [Theory]
    [InlineData("""{"horizon": 10, "rate": {"value": 0.1, "basis": "sideways"}, "elements": []}""", "rate.basis")]
    [InlineData("""{"horizon": "ten", "rate": {"value": 0.1}, "elements": []}""", "horizon")]
    [InlineData("""{"horizon": 10, "rate": {"value": 0.1}, "elements": [{"type": "lump"}]}""", "elements[0].type")]
    [InlineData("""{"horizon": 10, """, "body")]
    [InlineData("""[]""", "body")]
    public async Task Unreadable_json_names_the_field(string json, string field)
    {
        var (status, body, _) = await PostAsync(json);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.Equal([field], body.GetProperty("errors").EnumerateObject().Select(p => p.Name).ToArray());
    }

    [Fact]
    public async Task An_amount_beyond_the_number_range_is_named()
    {
        var (status, body, _) = await PostAsync("""
            {"horizon": 10, "rate": {"value": 0.1},
             "elements": [{"type": "single", "label": "a", "category": "capital", "period": 0, "amount": 1e999}]}
            """);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.Equal("Enter a finite number.", body.GetProperty("errors").GetProperty("elements[0].amount")[0].GetString());
    }

    [Fact]
    public async Task A_model_with_several_rates_of_return_reports_them_all()
    {
        var (status, body, _) = await PostAsync("""
            {"horizon": 3, "rate": {"value": 0.15},
             "elements": [
               {"type": "single", "label": "a", "category": "capital", "period": 0, "amount": -1000},
               {"type": "single", "label": "b", "category": "revenue", "period": 1, "amount": 3600},
               {"type": "single", "label": "c", "category": "operating", "period": 2, "amount": -4310},
               {"type": "single", "label": "d", "category": "revenue", "period": 3, "amount": 1716}]}
            """);
        Assert.Equal(HttpStatusCode.OK, status);
        JsonElement ror = body.GetProperty("rateOfReturn");
        Assert.False(ror.GetProperty("unique").GetBoolean());
        Assert.Equal("several", ror.GetProperty("kind").GetString());
        Assert.Equal([0.1, 0.2, 0.3], ror.GetProperty("roots").EnumerateArray().Select(r => Math.Round(r.GetDouble(), 10)).ToArray());
    }

    [Fact]
    public async Task Never_recovered_payback_is_null()
    {
        var (_, body, _) = await PostAsync("""
            {"horizon": 2, "rate": {"value": 0.1},
             "elements": [
               {"type": "single", "label": "a", "category": "capital", "period": 0, "amount": -1000},
               {"type": "uniform", "label": "b", "category": "revenue", "first": 1, "last": 2, "amount": 100}]}
            """);
        Assert.Equal(JsonValueKind.Null, body.GetProperty("payback").GetProperty("simple").ValueKind);
        Assert.Equal(JsonValueKind.Null, body.GetProperty("payback").GetProperty("discounted").ValueKind);
    }

    [Fact]
    public async Task Serves_an_OpenAPI_document_describing_the_endpoint()
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        var document = await client.GetFromJsonAsync<JsonElement>("/openapi/v1.json");
        JsonElement post = document.GetProperty("paths").GetProperty("/api/v1/evaluations").GetProperty("post");
        Assert.Equal("CreateEvaluation", post.GetProperty("operationId").GetString());
        Assert.True(post.GetProperty("responses").TryGetProperty("400", out _));
        Assert.True(document.GetProperty("components").GetProperty("schemas").TryGetProperty("EvaluationResponse", out _));
        // Every operation of the API, by the id docs/api.md and clients refer to.
        var operations = document.GetProperty("paths").EnumerateObject().SelectMany(p => p.Value.EnumerateObject()).Where(o => o.Name is "get" or "post" or "put" or "delete")
            .Select(o => o.Value.TryGetProperty("operationId", out var op) ? op.GetString() : o.Name + "?").Order(StringComparer.Ordinal).ToList();
        Assert.Equal(
        [
            "AddComment", "AddContingency", "AddMarrPolicy", "ApprovePortfolio", "CorrectCycle", "CreateCycle", "CreateEvaluation",
            "CreateProposal", "CreateRiskAnalysis", "DownloadPacket", "EditDraftVersion", "ExportAuditEvents", "ExportCycle",
            "ExportSignedCycle", "GetCycle", "GetCyclePortfolio", "GetCycleRanking", "GetPacketJob", "GetPortfolioRules", "GetProposal",
            "GetProposalVersion", "GetVersionIncrementalAnalysis", "GetVersionReplacementAnalysis", "ImportCycle", "ListAuditEvents",
            "ListComments", "ListCyclePackets", "ListCycles", "ListDecisions", "ListMarrPolicies", "ListPortfolioApprovals",
            "ListProposals", "ListSignOffs", "ListUsers", "MoveCycle", "RecordDecision", "RemoveContingency", "RemoveExclusiveGroup",
            "RequestPackets", "RetireMarrPolicy", "ReviseProposal", "SaveExclusiveGroup", "SetCyclePlan", "SetUserRoles",
            "SignOffCycle", "SubmitProposal", "WithdrawProposal",
        ], operations);
    }

    [Theory]
    [InlineData(null)]
    [InlineData("crv_not-a-token")]
    [InlineData("something-else")]
    public async Task Without_a_valid_token_the_api_answers_401_with_problem_details(string? token)
    {
        using HttpClient client = factory.CreateClient();
        if (token is not null)
        {
            client.DefaultRequestHeaders.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", token);
        }
        client.DefaultRequestHeaders.Accept.ParseAdd("application/json");
        using var content = new StringContent(Example, Encoding.UTF8, "application/json");
        using HttpResponseMessage response = await client.PostAsync("/api/v1/evaluations", content);
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        using HttpResponseMessage document = await client.GetAsync("/openapi/v1.json");
        Assert.Equal(HttpStatusCode.Unauthorized, document.StatusCode);
    }

    [Fact]
    public async Task Pages_that_need_a_sign_in_redirect_to_it()
    {
        using HttpClient client = factory.CreateClient(new Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        using HttpResponseMessage page = await client.GetAsync("/evaluate");
        Assert.Equal(HttpStatusCode.Redirect, page.StatusCode);
        Assert.StartsWith("/signin", page.Headers.Location!.PathAndQuery, StringComparison.Ordinal);
    }

    [Fact]
    public async Task The_database_is_created_and_migrated_on_first_start()
    {
        using HttpClient client = factory.CreateClient();
        using HttpResponseMessage page = await client.GetAsync("/signin");
        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        Assert.True(factory.Database.IsPostgreSql || File.Exists(new Microsoft.Data.Sqlite.SqliteConnectionStringBuilder(factory.Database.Settings.ConnectionString).DataSource));
        string html = await page.Content.ReadAsStringAsync();
        Assert.Contains("Tarnby Components Ltd", html);
    }
}
