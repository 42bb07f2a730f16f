using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using CsCheck;

namespace CapReview.Web.Tests.Security;

/// <summary>
/// Generated bad input for the JSON API: a valid body changed in a few random places (values swapped for others of any
/// type, members removed or added, deep nesting), then perhaps broken as text (cut short, a stray character, or replaced
/// by anything at all). A case is plain data, so CsCheck can print and shrink a failing one.
/// </summary>
public static class JsonFuzz
{
    /// <summary>One change at the member or element reached by <paramref name="Path"/> (each number picks a child, modulo their count).</summary>
    public sealed record Mutation(int Kind, int[] Path, string Key, string Value);

    /// <summary>Mutations of the body, then one change to its text.</summary>
    public sealed record Sample(Mutation[] Mutations, int TextKind, int Position, string Text);

    private static readonly string[] Scalars =
    [
        "null", "true", "false", "0", "-0", "1", "-1", "2147483648", "-9223372036854775809", "1e308", "1e400", "-1e400", "1e-400", "0.1", "3.5",
        "12345678901234567890", "\"\"", "\" \"", "\"single\"", "\"uniform\"", "\"arithmetic\"", "\"geometric\"", "\"recurring\"", "\"capital\"",
        "\"operating\"", "\"revenue\"", "\"salvage\"", "\"effective\"", "\"nominal\"", "\"continuous\"", "\"constant\"", "\"actual\"",
        "\"costReduction\"", "\"low\"", "\"' OR '1'='1\"", "\"1; DROP TABLE proposal; --\"", "\"<script>alert(1)</script>\"", "\"\\u0000\"",
        "\"\\ud800\"", "\"€\"", "\"../../etc/passwd\"", "\"NaN\"", "\"Infinity\"", "\"2027-02-30\"", "\"P-0001\"", "[]", "{}",
    ];

    private static readonly string[] Keys =
    [
        "horizon", "elements", "rate", "value", "basis", "compoundingsPerYear", "periodsPerYear", "type", "label", "category", "amount", "period",
        "first", "last", "every", "step", "growth", "money", "escalation", "expensed", "tax", "inflation", "title", "description", "assumptions", "model",
        "riskClass", "format", "version", "cycle", "proposals", "versions", "decisions", "$type", "$ref", "__proto__", "constructor",
    ];

    private static readonly string[] Fragments = ["{", "}", "[", "]", "\"", ",", ":", "\\", "\u0000", "\uFEFF", "/*", "NaN", "'", "\n"];

    public static readonly Gen<string> Scalar = Gen.Frequency(
        (6, Gen.OneOf<string>(Scalars)),
        (1, Gen.Double.Select(d => double.IsFinite(d) ? d.ToString("R", CultureInfo.InvariantCulture) : "0")),
        (1, Gen.Int.Select(i => i.ToString(CultureInfo.InvariantCulture))),
        (1, Gen.String.Select(s => JsonSerializer.Serialize(s))),
        (1, Gen.Int[1, 20_000].Select(n => "\"" + new string('x', n) + "\"")));

    /// <summary>Any JSON value up to <paramref name="depth"/> levels of arrays and objects.</summary>
    public static Gen<string> Value(int depth) => depth == 0 ? Scalar : Gen.Frequency(
        (5, Scalar),
        (1, Value(depth - 1).Array[0, 3].Select(items => "[" + string.Join(",", items) + "]")),
        (1, Gen.Select(Gen.OneOf<string>(Keys), Value(depth - 1)).Array[0, 3]
            .Select(members => "{" + string.Join(",", members.Select(m => JsonSerializer.Serialize(m.Item1) + ":" + m.Item2)) + "}")));

    public static readonly Gen<Sample> Samples = Gen.Select(
        Gen.Select(Gen.Int[0, 3], Gen.Int[0, 1000].Array[0, 5], Gen.OneOf<string>(Keys), Value(2), (kind, path, key, value) => new Mutation(kind, path, key, value)).Array[0, 4],
        Gen.Frequency((6, Gen.Const(0)), (1, Gen.Const(1)), (1, Gen.Const(2)), (1, Gen.Const(3))),
        Gen.Int[0, 100_000],
        Gen.Frequency((3, Gen.OneOf<string>(Fragments)), (1, Value(2)), (1, Gen.String)),
        (mutations, textKind, position, text) => new Sample(mutations, textKind, position, text));

    /// <summary>The body <paramref name="valid"/> with the case's changes.</summary>
    public static string Apply(string valid, Sample c)
    {
        ArgumentNullException.ThrowIfNull(c);
        string text = valid;
        foreach (Mutation m in c.Mutations)
        {
            try
            {
                text = Mutate(JsonNode.Parse(text)!, m).ToJsonString();
            }
            catch (Exception ex) when (ex is JsonException or InvalidOperationException or ArgumentException)
            {
                // A value System.Text.Json will not hold as a node (a lone surrogate, a repeated member); the text stage can still send it.
            }
        }
        return c.TextKind switch
        {
            1 => text[..(c.Position % (text.Length + 1))],
            2 => text.Insert(c.Position % (text.Length + 1), c.Text),
            3 => c.Text,
            _ => text,
        };
    }

    private static JsonNode Mutate(JsonNode root, Mutation m)
    {
        JsonNode? parent = null;
        JsonNode node = root;
        object? at = null;
        foreach (int pick in m.Path)
        {
            var children = Children(node);
            if (children.Count == 0)
            {
                break;
            }
            var (key, child) = children[pick % children.Count];
            if (child is null)
            {
                break;
            }
            at = key;
            parent = node;
            node = child;
        }
        JsonNode replacement = m.Kind == 3 ? Nested(70) : JsonNode.Parse(m.Value) ?? JsonValue.Create("")!;
        switch (m.Kind)
        {
            case 1 when parent is JsonObject obj:
                obj.Remove((string)at!);
                return root;
            case 1 when parent is JsonArray array:
                array.RemoveAt((int)at!);
                return root;
            case 2 when node is JsonObject target:
                target[m.Key] = replacement;
                return root;
            default:
                if (parent is null)
                {
                    return replacement;
                }
                if (parent is JsonObject o)
                {
                    o[(string)at!] = replacement;
                }
                else if (parent is JsonArray a)
                {
                    a[(int)at!] = replacement;
                }
                return root;
        }
    }

    private static List<(object Key, JsonNode? Child)> Children(JsonNode node) => node switch
    {
        JsonObject obj => [.. obj.Select(p => ((object)p.Key, p.Value))],
        JsonArray array => [.. array.Select((item, k) => ((object)k, item))],
        _ => [],
    };

    private static JsonNode Nested(int depth)
    {
        JsonNode node = new JsonArray();
        for (int k = 0; k < depth; k++)
        {
            node = new JsonArray(node);
        }
        return node;
    }
}
