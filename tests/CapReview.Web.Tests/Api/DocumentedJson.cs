using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;

namespace CapReview.Web.Tests.Api;

/// <summary>How docs/api.md's examples are read and compared: its http and json blocks, and a response that holds every field the document shows.</summary>
internal static partial class DocumentedJson
{
    /// <summary>Null when <paramref name="actual"/> holds every field the document promises, else where it differs.</summary>
    public static string? Mismatch(JsonElement expected, JsonElement actual, string path)
    {
        if (expected.ValueKind != actual.ValueKind && !(expected.ValueKind == JsonValueKind.Null && actual.ValueKind == JsonValueKind.Undefined))
        {
            return $"{path}: documented {expected.ValueKind}, got {actual.ValueKind} ({actual})";
        }
        switch (expected.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (JsonProperty property in expected.EnumerateObject())
                {
                    if (!actual.TryGetProperty(property.Name, out JsonElement value))
                    {
                        return $"{path}.{property.Name} is missing";
                    }
                    if (Mismatch(property.Value, value, $"{path}.{property.Name}") is { } inner)
                    {
                        return inner;
                    }
                }
                return null;
            case JsonValueKind.Array:
                if (expected.GetArrayLength() != actual.GetArrayLength())
                {
                    return $"{path}: documented {expected.GetArrayLength()} items, got {actual.GetArrayLength()}";
                }
                for (int k = 0; k < expected.GetArrayLength(); k++)
                {
                    if (Mismatch(expected[k], actual[k], $"{path}[{k}]") is { } inner)
                    {
                        return inner;
                    }
                }
                return null;
            case JsonValueKind.Number:
                double e = expected.GetDouble(), a = actual.GetDouble();
                return Math.Abs(e - a) <= 1e-9 * Math.Max(1.0, Math.Abs(e)) ? null : string.Create(CultureInfo.InvariantCulture, $"{path}: documented {e:R}, got {a:R}");
            default:
                return expected.ToString() == actual.ToString() ? null : $"{path}: documented {expected}, got {actual}";
        }
    }

    [GeneratedRegex(@"```http\n(.*?)\n```", RegexOptions.Singleline)]
    public static partial Regex HttpBlock();

    [GeneratedRegex(@"```json\n(.*?)\n```", RegexOptions.Singleline)]
    public static partial Regex JsonBlock();
}
