using System.Text.Json;
using System.Text.Json.Serialization;

namespace CapReview.Reviews.Interchange;

/// <summary>How a cycle document is written and read: camelCase, enums as camelCase strings, nulls left out, indented.</summary>
public static class CycleDocumentJson
{
    /// <summary>The largest document read, in bytes (a cycle of a few hundred proposals is well below it).</summary>
    public const int MaxBytes = 20 * 1024 * 1024;

    public static JsonSerializerOptions Options { get; } = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = true,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        NumberHandling = JsonNumberHandling.Strict,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false) },
    };

    public static byte[] Write(CycleDocument document) => JsonSerializer.SerializeToUtf8Bytes(document, Options);

    /// <summary>The document, or the one reason it cannot be read as JSON, with the path of the bad value.</summary>
    public static (CycleDocument? Document, string? Error) Read(byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        if (bytes.Length > MaxBytes)
        {
            return (null, $"The document is larger than {MaxBytes / 1024 / 1024} MiB.");
        }
        try
        {
            return (JsonSerializer.Deserialize<CycleDocument>(bytes, Options), null);
        }
        catch (JsonException ex)
        {
            string path = string.IsNullOrEmpty(ex.Path) || ex.Path == "$" ? "document" : ex.Path.TrimStart('$').TrimStart('.');
            return (null, $"{path}: this value is not valid here (line {ex.LineNumber + 1}); check its type and spelling.");
        }
    }
}
