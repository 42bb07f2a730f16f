using System.Text.Json;
using System.Text.Json.Serialization;

namespace CapReview.Web.Api;

/// <summary>
/// Reads a JSON number into a double only when a double holds it: <c>1e400</c> is valid JSON, but the reader would
/// make it infinity, which nothing can compute with or store. Refused like any malformed value, naming its path.
/// </summary>
public sealed class FiniteNumberConverter : JsonConverter<double>
{
    /// <summary>The refusal, the engine's own words for the same fault.</summary>
    public const string Message = "Enter a finite number.";

    /// <summary>What to tell the caller about a value the body's reader refused.</summary>
    public static string Refusal(JsonException ex) =>
        ex?.Message?.StartsWith(Message, StringComparison.Ordinal) == true ? Message : "This value is not valid here: check its type and spelling.";

    public override double Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        double value = reader.TokenType == JsonTokenType.Number ? reader.GetDouble()
            : throw new JsonException("Give a number.");
        return double.IsFinite(value) ? value : throw new JsonException(Message);
    }

    public override void Write(Utf8JsonWriter writer, double value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.WriteNumberValue(value);
    }
}
