using System.Text.Json;
using System.Text.Json.Nodes;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Display;

namespace CapReview.Reviews.Proposals;

/// <summary>What changed between two versions: every field, and every measure at the MARR each version is evaluated at.</summary>
public sealed record VersionDifference(int From, int To, IReadOnlyList<FieldChange> Fields, IReadOnlyList<MeasureChange> Measures);

/// <summary>One measure of worth in both versions and the change; null where a version has no value for it.</summary>
public sealed record MeasureChange(string Measure, double? Before, double? After)
{
    public double? Change => Before is double b && After is double a ? a - b : null;
}

/// <summary>Compares two versions of a proposal side by side.</summary>
public static class VersionComparison
{
    /// <summary>
    /// Elements are matched by their identity (so a reordering is no change), the other fields leaf by leaf in the
    /// canonical JSON; each change is named in words, by the later version's numbering of the elements (the earlier
    /// one's for an element removed), with its effect on present worth: the later version's present worth less its
    /// present worth with that one change undone, every other change held, at the later version's MARR (its own
    /// override, else <paramref name="policyMarr"/>). The measures are evaluated at each version's MARR.
    /// </summary>
    public static VersionDifference Compare(VersionView before, VersionView after, AnnualRate policyMarr)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        ProposalAssumptions from = ElementIdentities.Stamp(before.Assumptions), to = ElementIdentities.Stamp(after.Assumptions);
        JsonObject left = Document(from), right = Document(to);
        Evaluation? b = Evaluate(before.Assumptions, policyMarr), a = Evaluate(after.Assumptions, policyMarr);
        double? worth = a?.PresentWorth;
        double? Effect(JsonObject undone) => worth is double w && Read(undone) is { } reverted && Evaluate(reverted, policyMarr)?.PresentWorth is double r ? w - r : null;

        var fields = new List<FieldChange>();
        fields.AddRange(ElementChanges(left, right, from, to, before.Number, Effect));
        var leftLeaves = Leaves(WithoutElements(left));
        var rightLeaves = Leaves(WithoutElements(right));
        foreach (string path in leftLeaves.Keys.Union(rightLeaves.Keys).Order(StringComparer.Ordinal))
        {
            JsonNode? was = leftLeaves.GetValueOrDefault(path), now = rightLeaves.GetValueOrDefault(path);
            if (was?.ToJsonString() == now?.ToJsonString())
            {
                continue;
            }
            var undone = (JsonObject)right.DeepClone();
            double? effect = Put(undone, path, was?.DeepClone()) ? Effect(undone) : null;
            FieldWords words = FieldWording.Of(path, path.StartsWith("risk", StringComparison.Ordinal) && now is null ? from : to);
            fields.Add(new FieldChange(path, was?.ToJsonString(), now?.ToJsonString(), words.Subject, words.Part ?? "", ChangeValue.Of(path, was), ChangeValue.Of(path, now), effect));
        }

        var measures = new List<MeasureChange>
        {
            new("Present worth", b?.PresentWorth, a?.PresentWorth),
            new("Annual worth", b?.AnnualWorth, a?.AnnualWorth),
            new("Future worth", b?.FutureWorth, a?.FutureWorth),
            new("Rate of return", b?.UniqueRateOfReturn, a?.UniqueRateOfReturn),
            new("External rate of return", b?.ExternalRate, a?.ExternalRate),
            new("Simple payback, years", b?.SimplePaybackYears, a?.SimplePaybackYears),
            new("Discounted payback, years", b?.DiscountedPaybackYears, a?.DiscountedPaybackYears),
            new("Benefit-cost ratio", b?.BenefitCost.Conventional, a?.BenefitCost.Conventional),
            new("Modified benefit-cost ratio", b?.BenefitCost.Modified, a?.BenefitCost.Modified),
        };
        return new VersionDifference(before.Number, after.Number, fields, measures);
    }

    /// <summary>The version's measures under a policy (its MARR for the risk class, its inflation), or null when the model is not complete.</summary>
    public static Evaluation? Evaluate(ProposalAssumptions assumptions, Marr.MarrPolicyVersion policy, RiskClass risk) =>
        Evaluator.Evaluate(ProposalTerms.Model(assumptions, policy, risk)).Value;

    /// <summary>The version's measures, or null when its model is not complete.</summary>
    public static Evaluation? Evaluate(ProposalAssumptions assumptions, AnnualRate policyMarr)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        RateSpec rate = assumptions.MarrOverride?.Rate ?? new RateSpec
        {
            Value = policyMarr.Value,
            Basis = policyMarr.Basis,
            CompoundingsPerYear = policyMarr.Basis == RateBasis.Nominal ? policyMarr.CompoundingsPerYear : null,
        };
        var outcome = Evaluator.Evaluate(assumptions.Model with { Rate = rate });
        return outcome.Value;
    }

    /// <summary>Elements by identity: each one added or removed, and each field of one kept that differs.</summary>
    private static IEnumerable<FieldChange> ElementChanges(JsonObject left, JsonObject right, ProposalAssumptions from, ProposalAssumptions to,
        int fromNumber, Func<JsonObject, double?> effect)
    {
        JsonArray was = Elements(left), now = Elements(right);
        for (int k = 0; k < now.Count; k++)
        {
            if (now[k] is not JsonObject element)
            {
                continue;
            }
            string? id = element["id"]?.GetValue<string>();
            int earlier = IndexOf(was, id);
            if (earlier < 0)
            {
                var undone = (JsonObject)right.DeepClone();
                Elements(undone).RemoveAt(k);
                FieldWords added = FieldWording.Of($"model.elements[{k}]", to);
                yield return new FieldChange($"model.elements[{k}]", null, element.ToJsonString(), added.Subject, "added", ChangeValue.None, ChangeValue.Element(element), effect(undone));
                continue;
            }
            var oldElement = (JsonObject)was[earlier]!;
            foreach (string name in oldElement.Select(p => p.Key).Union(element.Select(p => p.Key)).Where(n => n != "id").Order(StringComparer.Ordinal))
            {
                JsonNode? before = oldElement[name], after = element[name];
                if (before?.ToJsonString() == after?.ToJsonString())
                {
                    continue;
                }
                var undone = (JsonObject)right.DeepClone();
                var target = (JsonObject)Elements(undone)[k]!;
                target.Remove(name);
                if (before is not null)
                {
                    target[name] = before.DeepClone();
                }
                string path = $"model.elements[{k}].{name}";
                // The label's own change is named by the element's number and its earlier label, so the row does not name the element by the text it reports.
                FieldWords words = FieldWording.Of(name == "label" ? $"model.elements[{earlier}].{name}" : path, name == "label" ? from : to);
                string subject = name == "label" ? words.Subject.Replace($"Element {earlier + 1}", $"Element {k + 1}", StringComparison.Ordinal) : words.Subject;
                yield return new FieldChange(path, before?.ToJsonString(), after?.ToJsonString(), subject, words.Part ?? "", ChangeValue.Of(name, before), ChangeValue.Of(name, after), effect(undone));
            }
        }
        for (int k = 0; k < was.Count; k++)
        {
            if (was[k] is JsonObject element && IndexOf(now, element["id"]?.GetValue<string>()) < 0)
            {
                var undone = (JsonObject)right.DeepClone();
                Elements(undone).Add(element.DeepClone());
                FieldWords removed = FieldWording.Of($"model.elements[{k}]", from);
                yield return new FieldChange($"model.elements[{k}]", element.ToJsonString(), null, removed.Subject + $" (numbered as in version {fromNumber})", "removed",
                    ChangeValue.Element(element), ChangeValue.None, effect(undone));
            }
        }
    }

    private static int IndexOf(JsonArray elements, string? id)
    {
        for (int k = 0; id is not null && k < elements.Count; k++)
        {
            if (elements[k]?["id"]?.GetValue<string>() == id)
            {
                return k;
            }
        }
        return -1;
    }

    private static JsonObject Document(ProposalAssumptions assumptions) => (JsonObject)JsonNode.Parse(AssumptionsDocument.Serialize(assumptions))!;

    private static JsonArray Elements(JsonObject document)
    {
        var model = (JsonObject)document["model"]!;
        if (model["elements"] is not JsonArray elements)
        {
            elements = [];
            model["elements"] = elements;
        }
        return elements;
    }

    private static JsonObject WithoutElements(JsonObject document)
    {
        var copy = (JsonObject)document.DeepClone();
        ((JsonObject?)copy["model"])?.Remove("elements");
        return copy;
    }

    private static ProposalAssumptions? Read(JsonObject document)
    {
        try
        {
            return AssumptionsDocument.Deserialize(document.ToJsonString());
        }
        catch (JsonException)
        {
            return null;
        }
    }

    /// <summary>Sets (or, for null, removes) the leaf at a path of names and [index]es; false when the path cannot be followed.</summary>
    private static bool Put(JsonObject root, string path, JsonNode? value)
    {
        string[] names = path.Replace("[", ".[", StringComparison.Ordinal).Split('.');
        JsonNode current = root;
        for (int k = 0; k < names.Length - 1; k++)
        {
            JsonNode? next = Child(current, names[k]);
            if (next is null)
            {
                if (value is null || current is not JsonObject parent)
                {
                    return value is null;
                }
                next = names[k + 1].StartsWith('[') ? new JsonArray() : new JsonObject();
                parent[names[k]] = next;
            }
            current = next;
        }
        string last = names[^1];
        switch (current)
        {
            case JsonObject obj:
                obj.Remove(last);
                if (value is not null)
                {
                    obj[last] = value;
                }
                return true;
            case JsonArray array when int.TryParse(last.Trim('[', ']'), out int index):
                if (index < array.Count)
                {
                    array[index] = value;
                    return true;
                }
                return false;
            default:
                return false;
        }
    }

    private static JsonNode? Child(JsonNode node, string name) => node switch
    {
        JsonObject obj => obj[name],
        JsonArray array when int.TryParse(name.Trim('[', ']'), out int index) && index < array.Count => array[index],
        _ => null,
    };

    private static Dictionary<string, JsonNode?> Leaves(JsonNode document)
    {
        var leaves = new Dictionary<string, JsonNode?>(StringComparer.Ordinal);
        Walk(document, "", leaves);
        return leaves;
    }

    private static void Walk(JsonNode? node, string path, Dictionary<string, JsonNode?> leaves)
    {
        switch (node)
        {
            case JsonObject obj:
                foreach (var (name, child) in obj)
                {
                    Walk(child, path.Length == 0 ? name : $"{path}.{name}", leaves);
                }
                break;
            case JsonArray array:
                for (int k = 0; k < array.Count; k++)
                {
                    Walk(array[k], string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{path}[{k}]"), leaves);
                }
                break;
            case null:
                break;
            default:
                leaves[path] = node;
                break;
        }
    }
}
