using System.Text.Json;
using System.Text.Json.Serialization;

namespace CapReview.Web.Api;

/// <summary>The API's JSON conventions: camelCase names, enums as camelCase strings, no numbers in quotes.</summary>
public static class ApiJson
{
    public static JsonSerializerOptions Options { get; } = Configure(new JsonSerializerOptions(JsonSerializerDefaults.Web));

    public static JsonSerializerOptions Configure(JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        options.NumberHandling = JsonNumberHandling.Strict;
        options.Converters.Add(new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false));
        options.Converters.Add(new FiniteNumberConverter());
        return options;
    }
}
