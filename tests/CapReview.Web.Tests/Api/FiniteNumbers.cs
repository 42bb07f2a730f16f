using System.Text.Json;

namespace CapReview.Web.Tests.Api;

/// <summary>Walks a JSON answer: every number in it is a finite double (a figure the API cannot hold is null instead).</summary>
internal static class FiniteNumbers
{
    public static void Assert(JsonElement element, string where)
    {
        switch (element.ValueKind)
        {
            case JsonValueKind.Number:
                Xunit.Assert.True(element.TryGetDouble(out double value) && double.IsFinite(value), $"{where}: the number {element.GetRawText()} is not a finite double");
                break;
            case JsonValueKind.Array:
                foreach (JsonElement item in element.EnumerateArray())
                {
                    Assert(item, where);
                }
                break;
            case JsonValueKind.Object:
                foreach (JsonProperty property in element.EnumerateObject())
                {
                    Assert(property.Value, where + "." + property.Name);
                }
                break;
            default:
                break;
        }
    }

    /// <summary>
    /// Every measure of an evaluation in the form of POST /api/v1/evaluations that is null has its reason in
    /// <c>unavailable</c>, and none with a value has one.
    /// </summary>
    public static void AssertNullsExplained(JsonElement evaluation, string where)
    {
        JsonElement unavailable = evaluation.GetProperty("unavailable");
        foreach (var (name, value) in new (string, JsonElement)[]
        {
            ("futureWorth", evaluation.GetProperty("futureWorth")), ("capitalizedWorth", evaluation.GetProperty("capitalizedWorth")),
            ("externalRate", evaluation.GetProperty("externalRate")), ("payback.simple", evaluation.GetProperty("payback").GetProperty("simple")),
            ("payback.discounted", evaluation.GetProperty("payback").GetProperty("discounted")),
            ("benefitCostRatio.conventional", evaluation.GetProperty("benefitCostRatio").GetProperty("conventional")),
            ("benefitCostRatio.modified", evaluation.GetProperty("benefitCostRatio").GetProperty("modified")),
        })
        {
            bool explained = unavailable.TryGetProperty(name, out JsonElement reason) && reason.GetString() is { Length: > 0 };
            Xunit.Assert.True(value.ValueKind == JsonValueKind.Null ? explained : !explained, $"{where}: {name} is {value.GetRawText()}, reason {(explained ? reason.GetString() : "none")}");
        }
    }
}
