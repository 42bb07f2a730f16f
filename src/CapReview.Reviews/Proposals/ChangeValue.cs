using System.Text.Json;
using System.Text.Json.Nodes;
using CapReview.Reviews.Display;

namespace CapReview.Reviews.Proposals;

/// <summary>How a changed value is written: as money, a rate, a count of periods, a plain number or words.</summary>
public enum ChangeValueKind
{
    None,
    Money,
    Percent,
    Count,
    Plain,
    Words,
    Element,
}

/// <summary>One side of a change, kept as a number or words so that each reader writes it by the one display rule.</summary>
public sealed record ChangeValue(ChangeValueKind Kind, double? Number, string? Text)
{
    public static readonly ChangeValue None = new(ChangeValueKind.None, null, null);

    public string Show(NumberDisplay format)
    {
        ArgumentNullException.ThrowIfNull(format);
        return (Kind, Number) switch
        {
            (ChangeValueKind.Money, double v) => format.Money(v),
            (ChangeValueKind.Percent, double v) => format.Percent(v),
            (ChangeValueKind.Count, double v) => format.Number(v, 0),
            (ChangeValueKind.Plain, double v) => format.Number(v, Math.Abs(v) >= 100 ? 0 : 4),
            (ChangeValueKind.Element, double v) => $"{Text}, amount {format.Money(v)}",
            (ChangeValueKind.Words or ChangeValueKind.Element, _) => Text ?? "—",
            _ => "—",
        };
    }

    /// <summary>The value of the field named last in <paramref name="path"/>, as stored in the canonical JSON.</summary>
    public static ChangeValue Of(string path, JsonNode? node)
    {
        ArgumentNullException.ThrowIfNull(path);
        string leaf = path[(path.LastIndexOf('.') + 1)..];
        leaf = leaf.Contains('[', StringComparison.Ordinal) ? leaf[..leaf.IndexOf('[', StringComparison.Ordinal)] : leaf;
        if (node is not JsonValue value)
        {
            return node is null ? None : new(ChangeValueKind.Words, null, node.ToJsonString());
        }
        return value.GetValueKind() switch
        {
            JsonValueKind.String => new(ChangeValueKind.Words, null, EnumWording.FromStored(leaf, value.GetValue<string>()) ?? value.GetValue<string>()),
            JsonValueKind.True => new(ChangeValueKind.Words, null, "yes"),
            JsonValueKind.False => new(ChangeValueKind.Words, null, "no"),
            JsonValueKind.Number => new(KindOf(leaf), value.GetValue<double>(), null),
            _ => None,
        };
    }

    /// <summary>A whole element: its shape and its amount.</summary>
    public static ChangeValue Element(JsonObject element)
    {
        ArgumentNullException.ThrowIfNull(element);
        string shape = element["type"] is JsonValue type && EnumWording.FromStored("type", type.GetValue<string>()) is { } words ? words : "Element";
        return new(ChangeValueKind.Element, element["amount"] is JsonValue amount ? amount.GetValue<double>() : null, shape);
    }

    private static ChangeValueKind KindOf(string leaf) => leaf switch
    {
        "growth" or "escalation" or "value" or "rate" or "share" => ChangeValueKind.Percent,
        _ when leaf.EndsWith("Rate", StringComparison.Ordinal) => ChangeValueKind.Percent,
        "period" or "first" or "last" or "every" or "horizon" or "periodsPerYear" or "trials" or "seed" or "life" or "term" or "baseYear"
            or "compoundingsPerYear" or "placedInPeriod" or "disposalPeriod" => ChangeValueKind.Count,
        "low" or "mostLikely" or "high" or "coefficient" or "probability" => ChangeValueKind.Plain,
        _ => ChangeValueKind.Money,
    };
}
