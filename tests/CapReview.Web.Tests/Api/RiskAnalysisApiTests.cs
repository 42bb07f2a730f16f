using System.Net;
using System.Text;
using System.Text.Json;

namespace CapReview.Web.Tests.Api;

/// <summary>
/// POST /api/v1/risk-analyses and the tax block of POST /api/v1/evaluations. Expected figures are worked out here from
/// the standard compound-interest factors.
/// </summary>
public sealed class RiskAnalysisApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    /// <summary>(P/A, 10 %, 10) = (1 − 1.1^−10) / 0.1.</summary>
    private static readonly double SeriesFactor = (1 - Math.Pow(1.1, -10)) / 0.1;

    private const string Model = """
        {"horizon": 10, "rate": {"value": 0.10},
         "elements": [
           {"id": "plant", "type": "single", "label": "Plant", "category": "capital", "period": 0, "amount": -400000},
           {"id": "saving", "type": "uniform", "label": "Saving", "category": "revenue", "first": 1, "last": 10, "amount": 70000}
         ]}
        """;

    private static string Request(int trials = 2_000, int seed = 11, string target = "elements[#saving].amount") => $$$"""
        {"model": {{{Model}}},
         "risk": {"trials": {{{trials}}}, "seed": {{{seed}}},
                  "parameters": [{"name": "Saving", "target": "{{{target}}}", "low": 50000, "mostLikely": 70000, "high": 90000}]}}
        """;

    private async Task<(HttpStatusCode Status, JsonElement Body)> PostAsync(string path, string json)
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        using var content = new StringContent(json, Encoding.UTF8, "application/json");
        using HttpResponseMessage response = await client.PostAsync(path, content);
        return (response.StatusCode, JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.Clone());
    }

    [Fact]
    public async Task The_tornado_and_break_even_are_the_hand_computed_ones()
    {
        var (status, body) = await PostAsync("/api/v1/risk-analyses", Request());
        Assert.Equal(HttpStatusCode.OK, status);
        JsonElement bar = body.GetProperty("tornado")[0];
        Assert.Equal("Saving", bar.GetProperty("parameter").GetString());
        Assert.Equal(-400_000 + 50_000 * SeriesFactor, bar.GetProperty("atLow").GetDouble(), 6);
        Assert.Equal(40_000 * SeriesFactor, bar.GetProperty("swing").GetDouble(), 6);
        Assert.Equal(400_000 / SeriesFactor, body.GetProperty("breakEven")[0].GetProperty("value").GetDouble(), 4);
        Assert.Equal(3, body.GetProperty("scenarios").GetArrayLength());
        Assert.Equal(11, body.GetProperty("spider")[0].GetProperty("values").GetArrayLength());
        Assert.False(body.GetProperty("afterTax").GetBoolean());
    }

    [Fact]
    public async Task The_same_seed_gives_the_same_simulation()
    {
        var (_, first) = await PostAsync("/api/v1/risk-analyses", Request(seed: 5));
        var (_, again) = await PostAsync("/api/v1/risk-analyses", Request(seed: 5));
        var (_, other) = await PostAsync("/api/v1/risk-analyses", Request(seed: 6));
        Assert.Equal(first.GetProperty("simulation").GetRawText(), again.GetProperty("simulation").GetRawText());
        Assert.NotEqual(first.GetProperty("simulation").GetProperty("mean").GetDouble(), other.GetProperty("simulation").GetProperty("mean").GetDouble());
        JsonElement simulation = first.GetProperty("simulation");
        Assert.Equal(2_000, simulation.GetProperty("trials").GetInt32());
        Assert.Equal(5, simulation.GetProperty("seed").GetInt32());
        Assert.Equal(40, simulation.GetProperty("histogram").GetArrayLength());
        foreach (string p in new[] { "p5", "p10", "p25", "p50", "p75", "p90", "p95" })
        {
            Assert.True(simulation.GetProperty("percentiles").TryGetProperty(p, out _), p);
        }
    }

    [Fact]
    public async Task More_trials_than_the_limit_are_refused_with_problem_details_naming_the_field()
    {
        var (status, body) = await PostAsync("/api/v1/risk-analyses", Request(trials: 1_000_001));
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.Equal(400, body.GetProperty("status").GetInt32());
        Assert.Contains("1,000,000", body.GetProperty("errors").GetProperty("risk.trials")[0].GetString(), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("""{"risk": {"parameters": []}}""", "model")]
    [InlineData("""{"model": {"horizon": 10, "rate": {"value": 0.1}, "elements": []}}""", "risk")]
    [InlineData("""{"model": {"horizon": "ten"}}""", "model.horizon")]
    public async Task Bad_input_is_problem_details_naming_the_field(string json, string field)
    {
        var (status, body) = await PostAsync("/api/v1/risk-analyses", json);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.True(body.GetProperty("errors").TryGetProperty(field, out _), body.GetRawText());
    }

    [Fact]
    public async Task A_parameter_naming_a_missing_element_or_a_bad_model_is_named()
    {
        var (status, body) = await PostAsync("/api/v1/risk-analyses", Request(target: "elements[#gone].amount"));
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.True(body.GetProperty("errors").TryGetProperty("risk.parameters[0].target", out _), body.GetRawText());

        string badModel = Request().Replace("\"horizon\": 10", "\"horizon\": 5", StringComparison.Ordinal);
        (status, body) = await PostAsync("/api/v1/risk-analyses", badModel);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.True(body.GetProperty("errors").EnumerateObject().Any(e => e.Name.StartsWith("model.elements[1]", StringComparison.Ordinal)), body.GetRawText());
    }

    [Fact]
    public async Task A_life_the_elements_outrun_is_refused_at_the_low_value()
    {
        // The saving runs to year 10: a life of 8 years cuts it off, so no figure can be made at that end.
        string life = Request().Replace("\"target\": \"elements[#saving].amount\", \"low\": 50000, \"mostLikely\": 70000, \"high\": 90000",
            "\"target\": \"horizon\", \"low\": 8, \"mostLikely\": 10, \"high\": 12", StringComparison.Ordinal);
        var (status, body) = await PostAsync("/api/v1/risk-analyses", life);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.StartsWith("Low: at 8 the model cannot be evaluated", body.GetProperty("errors").GetProperty("risk.parameters[0].low")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_most_likely_value_apart_from_the_model_is_reported_with_its_difference()
    {
        string apart = Request().Replace("\"mostLikely\": 70000", "\"mostLikely\": 65000", StringComparison.Ordinal);
        var (status, body) = await PostAsync("/api/v1/risk-analyses", apart);
        Assert.Equal(HttpStatusCode.OK, status);
        var drift = Assert.Single(body.GetProperty("differsFromModel").EnumerateArray());
        Assert.Equal(("Saving", 65_000.0, 70_000.0, -5_000.0), (drift.GetProperty("parameter").GetString(), drift.GetProperty("mostLikely").GetDouble(), drift.GetProperty("current").GetDouble(), drift.GetProperty("difference").GetDouble()));

        var (_, following) = await PostAsync("/api/v1/risk-analyses", Request());
        Assert.Empty(following.GetProperty("differsFromModel").EnumerateArray());
    }

    [Fact]
    public async Task A_body_over_the_size_limit_is_refused()
    {
        string padding = new(' ', 1_000_001);
        var (status, body) = await PostAsync("/api/v1/risk-analyses", "{" + padding + "}");
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.True(body.GetProperty("errors").TryGetProperty("body", out _));
    }

    [Fact]
    public async Task With_a_tax_block_the_analysis_is_after_tax()
    {
        const string tax = """ "tax": {"incomeTaxRate": 0.25, "depreciation": {"method": "straightLine", "life": 10}, "afterTaxMarr": {"value": 0.075}}, "risk":""";
        string taxed = Request().Replace("\"risk\":", tax, StringComparison.Ordinal);
        var (status, body) = await PostAsync("/api/v1/risk-analyses", taxed);
        Assert.Equal(HttpStatusCode.OK, status);
        Assert.True(body.GetProperty("afterTax").GetBoolean());
        // Straight line: 40,000 a year deducted, so each year's after-tax flow is 0.75 × saving + 10,000, at 7.5 %.
        double factor = (1 - Math.Pow(1.075, -10)) / 0.075;
        Assert.Equal(0.75 * 40_000 * factor, body.GetProperty("tornado")[0].GetProperty("swing").GetDouble(), 5);
    }

    [Fact]
    public async Task An_evaluation_with_a_tax_block_answers_the_after_tax_figures_beside_the_before_tax_ones()
    {
        const string taxed = """
            {"horizon": 5, "rate": {"value": 0.10},
             "elements": [
               {"type": "single", "label": "Lathe", "category": "capital", "period": 0, "amount": -100000},
               {"type": "uniform", "label": "Contribution", "category": "revenue", "first": 1, "last": 5, "amount": 40000}
             ],
             "tax": {"incomeTaxRate": 0.25, "depreciation": {"method": "straightLine", "life": 5}, "afterTaxMarr": {"value": 0.08}}}
            """;
        var (status, body) = await PostAsync("/api/v1/evaluations", taxed);
        Assert.Equal(HttpStatusCode.OK, status);
        // Before tax: −100,000 + 40,000 (P/A, 10 %, 5).
        Assert.Equal(-100_000 + 40_000 * (1 - Math.Pow(1.1, -5)) / 0.1, body.GetProperty("presentWorth").GetDouble(), 6);
        JsonElement after = body.GetProperty("afterTax");
        // Straight line: 20,000 a year; taxable 20,000; tax 5,000; after-tax flow 35,000 (hand computation).
        Assert.Equal([20_000.0, 20_000, 20_000, 20_000, 20_000], after.GetProperty("depreciation").GetProperty("amounts").EnumerateArray().Select(a => a.GetDouble()));
        Assert.Equal(0, after.GetProperty("depreciation").GetProperty("bookValues")[4].GetDouble(), 6);
        JsonElement year3 = after.GetProperty("flows")[3];
        Assert.Equal(5_000, year3.GetProperty("tax").GetDouble(), 6);
        Assert.Equal(35_000, year3.GetProperty("afterTax").GetDouble(), 6);
        Assert.Equal(-100_000 + 35_000 * (1 - Math.Pow(1.08, -5)) / 0.08, after.GetProperty("measures").GetProperty("presentWorth").GetDouble(), 6);
        Assert.False(after.TryGetProperty("equity", out _));
    }

    [Fact]
    public async Task An_evaluation_without_tax_answers_as_before_and_a_bad_tax_field_is_named()
    {
        var (status, body) = await PostAsync("/api/v1/evaluations", Model);
        Assert.Equal(HttpStatusCode.OK, status);
        Assert.False(body.TryGetProperty("afterTax", out _));

        string badTax = Model.TrimEnd().TrimEnd('}') + """, "tax": {"incomeTaxRate": "a quarter"}}""";
        (status, body) = await PostAsync("/api/v1/evaluations", badTax);
        Assert.Equal(HttpStatusCode.BadRequest, status);
        Assert.True(body.GetProperty("errors").TryGetProperty("tax.incomeTaxRate", out _), body.GetRawText());
    }
    [Fact]
    public async Task A_horizon_whose_moves_make_no_valid_model_answers_nulls_or_names_the_value_not_a_server_error()
    {
        // The horizon at −50 % (5) cuts the saving that runs to year 10: that point of the spider has no valid model
        // and is null. A low, most likely or high value of 1 … 3 years has none either: refused at that value, not a 5xx.
        string spider = $$$"""{"model": {{{Model}}}, "risk": {"trials": 50, "parameters": [{"name": "Life", "target": "horizon", "low": 10, "mostLikely": 10, "high": 14}]}}""";
        var (status, body) = await PostAsync("/api/v1/risk-analyses", spider);
        Assert.Equal(HttpStatusCode.OK, status);
        Assert.Contains(body.GetProperty("spider")[0].GetProperty("values").EnumerateArray(), v => v.ValueKind == JsonValueKind.Null);

        string none = $$$"""{"model": {{{Model}}}, "risk": {"trials": 50, "parameters": [{"name": "Life", "target": "horizon", "low": 1, "mostLikely": 2, "high": 3}]}}""";
        var (noneStatus, noneBody) = await PostAsync("/api/v1/risk-analyses", none);
        Assert.Equal(HttpStatusCode.BadRequest, noneStatus);
        Assert.True(noneBody.GetProperty("errors").TryGetProperty("risk.parameters[0].low", out _), noneBody.GetRawText());
    }
}

