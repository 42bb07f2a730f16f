using System.Net;
using System.Text;
using System.Text.Json;

namespace CapReview.Web.Tests.Api;

/// <summary>A later capital cost is depreciated after tax unless the request marks it as a repair; the flag is named when it does not apply.</summary>
public sealed class OutlayApiTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    // An invented press: 100,000 now, an overhaul of 40,000 at year 3, 30,000 saved a year, resold for 10,000 at year 7.
    private static string Press(string overhaulFlag = "", string savingFlag = "") => """
        {"horizon": 7, "rate": {"value": 0.10},
         "elements": [
           {"type": "single", "label": "Press", "category": "capital", "period": 0, "amount": -100000},
           {"type": "uniform", "label": "Labour saved", "category": "revenue", "first": 1, "last": 7, "amount": 30000SAVING-FLAG},
           {"type": "single", "label": "Overhaul", "category": "capital", "period": 3, "amount": -40000OVERHAUL-FLAG},
           {"type": "single", "label": "Resale", "category": "salvage", "period": 7, "amount": 10000}
         ],
         "tax": {"incomeTaxRate": 0.25, "depreciation": {"method": "macrs", "propertyClass": "fiveYear"}}}
        """.Replace("SAVING-FLAG", savingFlag, StringComparison.Ordinal).Replace("OVERHAUL-FLAG", overhaulFlag, StringComparison.Ordinal);

    private async Task<(HttpStatusCode Status, JsonElement Body)> PostAsync(string json)
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        using var content = new StringContent(json, Encoding.UTF8, "application/json");
        using HttpResponseMessage response = await client.PostAsync("/api/v1/evaluations", content);
        return (response.StatusCode, JsonDocument.Parse(await response.Content.ReadAsStringAsync()).RootElement.Clone());
    }

    private static double[] Depreciation(JsonElement body) =>
        [.. body.GetProperty("afterTax").GetProperty("flows").EnumerateArray().Select(f => Math.Round(f.GetProperty("depreciation").GetDouble(), 6))];

    [Fact]
    public async Task An_overhaul_is_depreciated_from_its_year_and_a_repair_is_deducted_in_it()
    {
        var (status, body) = await PostAsync(Press());
        Assert.Equal(HttpStatusCode.OK, status);
        // IRS Publication 946, Table A-1 (5-year, half-year): the press 20, 32, 19.2, 11.52, 11.52, 5.76 %; the overhaul
        // the same from year 3, with half of its fifth year's 11.52 % in year 7, the year of sale before the end of its recovery.
        Assert.Equal([0, 20_000, 32_000, 27_200, 24_320, 19_200, 10_368, 2_304], Depreciation(body));
        Assert.Equal(4_608, body.GetProperty("afterTax").GetProperty("bookValueAtDisposal").GetDouble(), 6);

        (status, body) = await PostAsync(Press(overhaulFlag: ", \"expensed\": true"));
        Assert.Equal(HttpStatusCode.OK, status);
        Assert.Equal([0, 20_000, 32_000, 19_200, 11_520, 11_520, 5_760, 0], Depreciation(body));
        // The repair deducted in year 3: 25 % × (30,000 − 40,000 − 19,200).
        Assert.Equal(-7_300, body.GetProperty("afterTax").GetProperty("flows")[3].GetProperty("tax").GetDouble(), 6);
    }

    [Fact]
    public async Task The_flag_on_an_element_that_is_not_a_later_capital_cost_is_named()
    {
        var (status, body) = await PostAsync(Press(savingFlag: ", \"expensed\": true"));
        Assert.Equal(HttpStatusCode.BadRequest, status);
        JsonElement errors = body.GetProperty("errors");
        Assert.Equal(["elements[1].expensed"], errors.EnumerateObject().Select(p => p.Name));
        Assert.Contains("Only a capital cost after period 0", errors.GetProperty("elements[1].expensed")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task An_overhaul_of_its_own_class_is_depreciated_by_it_and_a_class_that_does_not_fit_is_named()
    {
        var (status, body) = await PostAsync(Press(overhaulFlag: ", \"depreciatedAs\": {\"propertyClass\": \"threeYear\"}"));
        Assert.Equal(HttpStatusCode.OK, status);
        // IRS Publication 946, Table A-1: the press as 5-year property, 20, 32, 19.2, 11.52, 11.52, 5.76 %; the overhaul
        // of 40,000 as 3-year property from year 3, 33.33, 44.45, 14.81, 7.41 % (the table's rounding of 1/3, 4/9, 4/27,
        // 2/27), all four years before the horizon at year 7, so none is cut.
        double[] hand = [0, 20_000, 32_000, 19_200 + 13_333.33, 11_520 + 17_777.78, 11_520 + 5_925.93, 5_760 + 2_962.96, 0];
        Assert.Equal(hand, Depreciation(body).Select(d => Math.Round(d, 2)));

        (status, body) = await PostAsync(Press(overhaulFlag: ", \"depreciatedAs\": {\"life\": 10}"));
        Assert.Equal(HttpStatusCode.BadRequest, status);
        JsonElement errors = body.GetProperty("errors");
        Assert.Equal(["elements[2].depreciatedAs"], errors.EnumerateObject().Select(p => p.Name));
        Assert.Equal("The first cost is depreciated by MACRS: choose a MACRS property class.", errors.GetProperty("elements[2].depreciatedAs")[0].GetString());
    }

    [Fact]
    public async Task The_OpenAPI_document_describes_the_flag()
    {
        using HttpClient client = await factory.CreateAuthenticatedClientAsync();
        var document = JsonDocument.Parse(await client.GetStringAsync(new Uri("/openapi/v1.json", UriKind.Relative))).RootElement;
        JsonElement element = document.GetProperty("components").GetProperty("schemas").GetProperty("ElementSpec").GetProperty("properties");
        Assert.True(element.TryGetProperty("expensed", out _));
        Assert.True(element.TryGetProperty("depreciatedAs", out _));
    }
}
