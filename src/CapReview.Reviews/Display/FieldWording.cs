using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Display;

/// <summary>A field in words: what it belongs to ("Element 2, ‘Two operator positions saved’") and which of its parts ("amount").</summary>
public sealed record FieldWords(string Subject, string? Part)
{
    public override string ToString() => Part is null ? Subject : $"{Subject}, {Part}";
}

/// <summary>
/// The one place a field path (<c>model.elements[1].amount</c>, <c>risk.parameters[0].low</c>, <c>capitalLimit</c>)
/// becomes the words a person knows, numbered as the editor numbers (from 1) and named by its label where the
/// assumptions are at hand. The paths stay the machine's (the API's <c>errors</c> keys, the stored comparison); every
/// page, packet and human message goes through here.
/// </summary>
public static partial class FieldWording
{
    /// <summary>The field in words; <paramref name="assumptions"/>, when given, supplies the element labels and parameter names.</summary>
    public static FieldWords Of(string path, ProposalAssumptions? assumptions = null) => Of(path, assumptions?.Model, assumptions?.Risk);

    public static FieldWords Of(string path, ModelSpec? model, RiskSpec? risk = null)
    {
        ArgumentNullException.ThrowIfNull(path);
        var segments = new List<(string Name, string? Index)>();
        foreach (string part in path.Split('.'))
        {
            Match m = Segment().Match(part);
            if (!m.Success)
            {
                return new(Humanize(path), null);
            }
            segments.Add((m.Groups[1].Value, m.Groups[2].Success ? m.Groups[2].Value : null));
        }
        while (segments.Count > 1 && segments[0] is ("assumptions" or "model" or "body", null))
        {
            segments.RemoveAt(0);
        }
        return segments switch
        {
            [("elements", { } index), .. var rest] => Element(index, rest, model),
            [("risk", null), ("parameters", { } index), .. var rest] => Parameter(index, rest, risk),
            [("risk", null), ("scenarios", { } index), .. var rest] => Numbered("Scenario", index, rest, risk?.Scenarios?.ElementAtOrDefault(Position(index) ?? -1)?.Name),
            [("risk", null), ("correlations", { } index), .. var rest] => Numbered("Correlation", index, rest, null),
            [("risk", null), (var name, null)] => new(Capital(Word(name)), null),
            [("rate", null), .. var rest] => new("MARR", Rest(rest) is { } p && p != "rate" ? p : null),
            [("marrOverride", null), .. var rest] => new("The proposal's own MARR", Rest(rest.Where(s => s.Name != "rate" || rest.Count == 1).ToList())),
            [("inflation", null), ("rate", null)] => new("General inflation", null),
            [("tax", null), (var name, null)] => new(Capital(Word(name)), null),
            [("laterYearLimits", { } index)] => new($"Capital limit of budget year {Number(index)}", null),
            [("tax", null), ("depreciation", { } index), .. var rest] => Numbered("Depreciation", index, rest, null),
            [("tax", null), ("credits", { } index), .. var rest] => Numbered("Tax credit", index, rest, null),
            [("replacement", null), (var side and ("defender" or "challenger"), { } index), .. var rest] =>
                new($"{Capital(Word(side))}, year {Number(index)}", Rest(rest)),
            [(var head, null), .. var rest] when rest.Count > 0 => new(Capital(Word(head)), Rest(rest)),
            _ => new(Capital(Rest([.. segments.Where(s => s.Name is not ("assumptions" or "model"))]) ?? ""), null),
        };
    }

    /// <summary>The field in words, as one phrase.</summary>
    public static string Describe(string path, ProposalAssumptions? assumptions = null) => Of(path, assumptions).ToString();

    /// <summary>An input error as a person reads it: "Risk parameter 1, ‘Energy price’, low: Give a number.".</summary>
    public static string Message(InputError error, ProposalAssumptions? assumptions = null)
    {
        ArgumentNullException.ThrowIfNull(error);
        return $"{Describe(error.Field, assumptions)}: {error.Message}";
    }

    /// <summary>
    /// A message that starts with a field path ("capitalLimit: the capital limit must be above zero.") with the path
    /// put in words ("Capital limit: the capital limit must be above zero."); any other message unchanged.
    /// </summary>
    public static string InWords(string message)
    {
        ArgumentNullException.ThrowIfNull(message);
        return FieldOf(message) is { } field ? $"{Describe(field)}: {message[(field.Length + 2)..]}" : message;
    }

    /// <summary>The field path a message starts with ("elements[2].amount: …"), or null when it starts with words.</summary>
    public static string? FieldOf(string message)
    {
        ArgumentNullException.ThrowIfNull(message);
        Match m = LeadingPath().Match(message);
        return m.Success ? m.Groups[1].Value : null;
    }

    private static FieldWords Element(string index, List<(string Name, string? Index)> rest, ModelSpec? model)
    {
        int? position = index.StartsWith('#') ? IndexOfId(index[1..], model) : Position(index);
        ElementSpec? element = position is int p ? model?.Elements?.ElementAtOrDefault(p) : null;
        string subject = position is int k ? $"Element {(k + 1).ToString(CultureInfo.InvariantCulture)}" : "An element no longer in the model";
        if (!string.IsNullOrWhiteSpace(element?.Label))
        {
            subject += $", ‘{element.Label.Trim()}’";
        }
        string? part = rest switch
        {
            [("amount", null)] when element?.Type is ElementKind.Arithmetic or ElementKind.Geometric => "first amount",
            [("amount", null)] when element?.Type is ElementKind.Uniform => "amount each period",
            [(var name, null)] => Word(name),
            [] => null,
            _ => Rest(rest),
        };
        return new(subject, part);
    }

    private static FieldWords Parameter(string index, List<(string Name, string? Index)> rest, RiskSpec? risk)
    {
        string? name = risk?.Parameters?.ElementAtOrDefault(Position(index) ?? -1)?.Name;
        return Numbered("Risk parameter", index, rest, name);
    }

    private static FieldWords Numbered(string noun, string index, List<(string Name, string? Index)> rest, string? name)
    {
        string subject = $"{noun} {Number(index)}" + (string.IsNullOrWhiteSpace(name) ? "" : $", ‘{name.Trim()}’");
        return new(subject, Rest(rest));
    }

    private static string? Rest(List<(string Name, string? Index)> rest) => rest.Count == 0 ? null
        : string.Join(", ", rest.Select(s => Word(s.Name) + (s.Index is null ? "" : " " + Number(s.Index))));

    private static int? IndexOfId(string id, ModelSpec? model)
    {
        for (int e = 0; e < (model?.Elements?.Count ?? 0); e++)
        {
            if (model!.Elements![e]?.Id == id)
            {
                return e;
            }
        }
        return null;
    }

    private static int? Position(string index) => int.TryParse(index, NumberStyles.None, CultureInfo.InvariantCulture, out int k) ? k : null;

    private static string Number(string index) => Position(index) is int k ? (k + 1).ToString(CultureInfo.InvariantCulture) : index.TrimStart('#');

    /// <summary>One name of a path in words; a name not listed is split at its capitals ("disposalPeriod" → "disposal period").</summary>
    private static string Word(string name) => name switch
    {
        "amount" => "amount",
        "first" => "first period",
        "last" => "last period",
        "every" => "interval in periods",
        "step" => "change per period",
        "growth" => "growth per period",
        "type" => "shape",
        "money" => "money basis",
        "escalation" => "own escalation a year",
        "expensed" => "deducted as a repair",
        "depreciatedAs" => "depreciated as",
        "id" => "identity",
        "mostLikely" => "most likely",
        "target" => "input varied",
        "outcomes" => "values and probabilities",
        "value" => "rate",
        "basis" => "basis",
        "compoundingsPerYear" => "compoundings a year",
        "horizon" => "horizon",
        "periodsPerYear" => "period length",
        "incomeTaxRate" => "income-tax rate",
        "stateTaxRate" => "state tax rate",
        "gainTaxRate" => "tax rate on gains",
        "afterTaxMarr" => "after-tax MARR",
        "afterTaxRate" => "after-tax MARR",
        "inflationRate" => "general inflation",
        "baseYear" => "base year",
        "realMarr" => "MARR is real",
        "loan" => "loan",
        "share" => "share borrowed",
        "term" => "term",
        "defenderValueNow" => "market value now of the asset in service",
        "defender" => "asset in service",
        "challenger" => "proposed asset",
        "marketValue" => "market value",
        "operatingCost" => "operating cost",
        "valueAtStudyEnd" => "value at the end of the study period",
        "marrOverride" => "the proposal's own MARR",
        "capitalLimit" => "capital limit",
        "marrPolicyVersionId" => "MARR version",
        "cycleId" => "cycle",
        "proposalIds" => "proposals",
        "proposalId" => "proposal",
        "highRiskPremium" => "high-risk premium",
        "lowRiskPremium" => "low-risk premium",
        "standardRiskPremium" => "standard-risk premium",
        "assumptionsSha256" => "assumptions SHA-256",
        "opensOn" => "opening date",
        "closesOn" => "closing date",
        "requiredSignOffs" => "sign-offs required",
        "studyPeriod" => "study period",
        "text" => "comment",
        "body" => "request",
        "model" => "model",
        "proposals" => "proposal",
        "versions" => "version",
        "elements" => "element",
        "parameters" => "risk parameter",
        "scenarios" => "scenario",
        "correlations" => "correlation",
        "decisions" => "decision",
        "signOffs" => "sign-off",
        "tax" => "tax settings",
        "risk" => "risk settings",
        "trials" => "trials",
        "seed" => "seed",
        "inflation" => "general inflation",
        "rate" => "rate",
        _ => Humanize(name),
    };

    private static string Humanize(string name)
    {
        var words = new StringBuilder();
        foreach (char c in name)
        {
            if (char.IsUpper(c))
            {
                words.Append(' ').Append(char.ToLowerInvariant(c));
            }
            else
            {
                words.Append(c is '.' or '_' or '[' or ']' ? ' ' : c);
            }
        }
        return string.Join(' ', words.ToString().Split(' ', StringSplitOptions.RemoveEmptyEntries));
    }

    private static string Capital(string words) => words.Length == 0 ? words : char.ToUpperInvariant(words[0]) + words[1..];

    [GeneratedRegex(@"^([A-Za-z][A-Za-z0-9]*)(?:\[(#?[\w-]+)\])?$", RegexOptions.CultureInvariant)]
    private static partial Regex Segment();

    // A path is one or more names without spaces, with optional [index]: "capitalLimit", "model.elements[1].amount".
    [GeneratedRegex(@"^([a-z][A-Za-z0-9]*(?:\[#?[\w-]+\])?(?:\.[A-Za-z][A-Za-z0-9]*(?:\[#?[\w-]+\])?)*): ", RegexOptions.CultureInvariant)]
    private static partial Regex LeadingPath();
}
