using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Writes an entity whose setters are private and reads it back the way EF Core materialises its rows: through its
/// non-public parameterless constructor and its property setters. Only for documents the server wrote itself and
/// reads back unchanged (a page's persisted state, protected by the server's keys), never for input from outside,
/// which goes through the entities' named methods.
/// </summary>
internal sealed class PrivateStateConverter<T> : JsonConverter<T> where T : class
{
    private static readonly PropertyInfo[] Properties = [.. typeof(T)
        .GetProperties(BindingFlags.Public | BindingFlags.Instance)
        .Where(p => p.CanRead && p.SetMethod is not null && p.GetIndexParameters().Length == 0)];

    public override T Read(ref Utf8JsonReader reader, Type typeToConvert, JsonSerializerOptions options)
    {
        var entity = (T)(Activator.CreateInstance(typeof(T), nonPublic: true)
            ?? throw new JsonException($"{typeof(T).Name} cannot be made without its constructor's arguments."));
        using var document = JsonDocument.ParseValue(ref reader);
        foreach (var property in Properties)
        {
            if (document.RootElement.TryGetProperty(NameOf(property, options), out var value))
            {
                property.SetValue(entity, value.Deserialize(property.PropertyType, options));
            }
        }
        return entity;
    }

    public override void Write(Utf8JsonWriter writer, T value, JsonSerializerOptions options)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.WriteStartObject();
        foreach (var property in Properties)
        {
            writer.WritePropertyName(NameOf(property, options));
            JsonSerializer.Serialize(writer, property.GetValue(value), property.PropertyType, options);
        }
        writer.WriteEndObject();
    }

    private static string NameOf(PropertyInfo property, JsonSerializerOptions options) =>
        options.PropertyNamingPolicy?.ConvertName(property.Name) ?? property.Name;
}
