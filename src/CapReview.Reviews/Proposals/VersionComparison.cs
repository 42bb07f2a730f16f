using System.Globalization;
using System.Text.Json.Nodes;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Proposals;

/// <summary>One field that differs between two versions, by its path in the assumptions (e.g. model.elements[1].amount).</summary>
public sealed record FieldChange(string Path, string? Before, string? After);

/// <summary>One measure of worth in both versions and the change; null where a version has no value for it.</summary>
public sealed record MeasureChange(string Measure, double? Before, double? After)
{
    public double? Change => Before is double b && After is double a ? a - b : null;
}

/// <summary>What changed between two versions: every field, and every measure at the MARR each version is evaluated at.</summary>
public sealed record VersionDifference(int From, int To, IReadOnlyList<FieldChange> Fields, IReadOnlyList<MeasureChange> Measures);

/// <summary>Compares two versions of a proposal side by side.</summary>
public static class VersionComparison
{
    /// <summary>
    /// Fields are compared leaf by leaf in the canonical JSON (elements by position); measures are evaluated at each
    /// version's own MARR override, or at <paramref name="policyMarr"/>.
    /// </summary>
    public static VersionDifference Compare(VersionView before, VersionView after, AnnualRate policyMarr)
    {
        ArgumentNullException.ThrowIfNull(before);
        ArgumentNullException.ThrowIfNull(after);
        var left = Leaves(before.Assumptions);
        var right = Leaves(after.Assumptions);
        var fields = left.Keys.Union(right.Keys)
            .Where(path => left.GetValueOrDefault(path) != right.GetValueOrDefault(path))
            .OrderBy(path => path, StringComparer.Ordinal)
            .Select(path => new FieldChange(path, left.GetValueOrDefault(path), right.GetValueOrDefault(path)))
            .ToList();

        Evaluation? b = Evaluate(before.Assumptions, policyMarr), a = Evaluate(after.Assumptions, policyMarr);
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

    private static Dictionary<string, string> Leaves(ProposalAssumptions assumptions)
    {
        var leaves = new Dictionary<string, string>(StringComparer.Ordinal);
        // Both sides as written today, so a version stored before element identities does not show every id as a change.
        Walk(JsonNode.Parse(AssumptionsDocument.Serialize(ElementIdentities.Stamp(assumptions))), "", leaves);
        return leaves;
    }

    private static void Walk(JsonNode? node, string path, Dictionary<string, string> leaves)
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
                    Walk(array[k], string.Create(CultureInfo.InvariantCulture, $"{path}[{k}]"), leaves);
                }
                break;
            case null:
                break;
            default:
                leaves[path] = node.ToJsonString();
                break;
        }
    }
}
