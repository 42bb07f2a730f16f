using CapReview.Engine.Rates;
using CapReview.Engine.Validation;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Interchange;

/// <summary>
/// Every check an import makes before it writes: the format and its version, the required fields, references that
/// resolve inside the document, version numbers in order, and each version's assumptions against their SHA-256.
/// </summary>
public static class CycleDocumentCheck
{
    public static IReadOnlyList<InputError> Check(CycleDocument document)
    {
        ArgumentNullException.ThrowIfNull(document);
        var errors = new List<InputError>();
        void Add(string path, string message) => errors.Add(new(path, message));
        if (document.Format != CycleDocument.FormatName)
        {
            Add("format", $"This is not a CapReview cycle document (format “{CycleDocument.FormatName}”).");
            return errors;
        }
        if (document.FormatVersion != CycleDocument.CurrentVersion)
        {
            Add("formatVersion", $"This installation reads format version {CycleDocument.CurrentVersion}; the document is version {document.FormatVersion?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "(none)"}.");
            return errors;
        }
        if (document.Installation is { Length: > 200 })
        {
            Add("installation", "The exporting installation's name is at most 200 characters.");
        }
        CheckPolicy(document.MarrPolicy, Add);
        CheckCycle(document.Cycle, Add);
        var versions = new Dictionary<string, Dictionary<int, string>>(StringComparer.Ordinal);
        if (document.Proposals is null)
        {
            Add("proposals", "The document has no proposals list.");
        }
        for (int p = 0; p < (document.Proposals?.Count ?? 0); p++)
        {
            ProposalEntry entry = document.Proposals![p];
            string path = $"proposals[{p}]";
            if (string.IsNullOrWhiteSpace(entry.Reference) || entry.Reference.Length > 20)
            {
                Add($"{path}.reference", "Give the proposal's reference, at most 20 characters.");
                continue;
            }
            if (versions.ContainsKey(entry.Reference))
            {
                Add($"{path}.reference", $"{entry.Reference} appears twice.");
                continue;
            }
            if (string.IsNullOrWhiteSpace(entry.Title) || entry.Title.Trim().Length > 200)
            {
                Add($"{path}.title", "Give the title, at most 200 characters.");
            }
            var hashes = new Dictionary<int, string>();
            versions[entry.Reference] = hashes;
            if (entry.Versions is not { Count: > 0 })
            {
                Add($"{path}.versions", "A proposal has at least one version.");
                continue;
            }
            for (int v = 0; v < entry.Versions.Count; v++)
            {
                VersionEntry version = entry.Versions[v];
                string at = $"{path}.versions[{v}]";
                if (version.Number != v + 1)
                {
                    Add($"{at}.number", $"Versions are numbered 1, 2, … in order; expected {v + 1}.");
                    continue;
                }
                if (version.Assumptions?.Model is null)
                {
                    Add($"{at}.assumptions", "The version has no assumptions (at least a model).");
                    continue;
                }
                string hash = AssumptionsDocument.Hash(AssumptionsDocument.Serialize(version.Assumptions));
                if (!string.Equals(hash, version.AssumptionsSha256, StringComparison.Ordinal))
                {
                    Add($"{at}.assumptionsSha256", "The assumptions do not match their SHA-256: the document was changed after it was exported.");
                }
                hashes[v + 1] = hash;
            }
        }
        bool Known(string? reference) => reference is not null && versions.ContainsKey(reference);
        for (int g = 0; g < (document.ExclusiveGroups?.Count ?? 0); g++)
        {
            GroupEntry group = document.ExclusiveGroups![g];
            if (string.IsNullOrWhiteSpace(group.Name))
            {
                Add($"exclusiveGroups[{g}].name", "Give the group's name.");
            }
            foreach (string? missing in (group.Members ?? []).Where(m => !Known(m)))
            {
                Add($"exclusiveGroups[{g}].members", $"{missing ?? "(blank)"} is not a proposal of the document.");
            }
        }
        for (int c = 0; c < (document.Contingencies?.Count ?? 0); c++)
        {
            ContingencyEntry x = document.Contingencies![c];
            if (!Known(x.Dependent) || !Known(x.Prerequisite))
            {
                Add($"contingencies[{c}]", "Both proposals of a contingency must be in the document.");
            }
        }
        for (int d = 0; d < (document.Decisions?.Count ?? 0); d++)
        {
            DecisionEntry decision = document.Decisions![d];
            string at = $"decisions[{d}]";
            if (!Known(decision.Proposal))
            {
                Add($"{at}.proposal", $"{decision.Proposal ?? "(blank)"} is not a proposal of the document.");
            }
            else if (decision.Version is not int number || !versions[decision.Proposal!].TryGetValue(number, out string? hash))
            {
                Add($"{at}.version", $"{decision.Proposal} has no such version.");
            }
            else if (!string.Equals(hash, decision.AssumptionsSha256, StringComparison.Ordinal))
            {
                Add($"{at}.assumptionsSha256", "The decision names other assumptions than its version holds.");
            }
            if (decision.Outcome is null)
            {
                Add($"{at}.outcome", "Give the outcome: approve, reject or returnForChanges.");
            }
            if (string.IsNullOrWhiteSpace(decision.OverriddenRules) != string.IsNullOrWhiteSpace(decision.OverrideReason))
            {
                Add($"{at}.overrideReason", "An override names the rules it broke and the reason for it, both or neither.");
            }
            else if (decision.OverriddenRules?.Length > 4000 || decision.OverrideReason?.Length > 2000)
            {
                Add($"{at}.overrideReason", "The rules an override broke take at most 4,000 characters, its reason at most 2,000.");
            }
        }
        for (int s = 0; s < (document.SignOffs?.Count ?? 0); s++)
        {
            if (string.IsNullOrWhiteSpace(document.SignOffs![s].By?.Name))
            {
                Add($"signOffs[{s}].by.name", "Name who signed off.");
            }
        }
        return errors;
    }

    private static void CheckPolicy(PolicyEntry? policy, Action<string, string> add)
    {
        if (policy is null)
        {
            add("marrPolicy", "The document has no MARR policy.");
            return;
        }
        if (policy.Rate is not double rate)
        {
            add("marrPolicy.rate", "Give the MARR policy's rate.");
        }
        else
        {
            foreach (var e in MarrBounds.Check(rate, policy.Basis ?? RateBasis.Effective, policy.CompoundingsPerYear ?? 1, "marrPolicy.rate"))
            {
                add(e.Field, e.Message);
            }
        }
        if (policy.EffectiveFrom is null)
        {
            add("marrPolicy.effectiveFrom", "Give the date the policy took effect.");
        }
        foreach (var (name, value) in new[] { ("lowRiskPremium", policy.LowRiskPremium), ("standardRiskPremium", policy.StandardRiskPremium), ("highRiskPremium", policy.HighRiskPremium), ("inflationRate", policy.InflationRate), ("afterTaxRate", policy.AfterTaxRate) })
        {
            if (value is double v && (!double.IsFinite(v) || v <= -0.5 || v > 1.0))
            {
                add($"marrPolicy.{name}", "Must lie between −50 % and 100 %.");
            }
        }
    }

    private static void CheckCycle(CycleEntry? cycle, Action<string, string> add)
    {
        if (cycle is null)
        {
            add("cycle", "The document has no cycle.");
            return;
        }
        if (string.IsNullOrWhiteSpace(cycle.Name) || cycle.Name.Trim().Length > 200)
        {
            add("cycle.name", "Give the cycle's name, at most 200 characters.");
        }
        if (cycle.CapitalLimit is not decimal limit || limit < 0)
        {
            add("cycle.capitalLimit", "Give the capital limit, zero or more.");
        }
        if (cycle.OpensOn is null || cycle.ClosesOn is null || cycle.ClosesOn < cycle.OpensOn)
        {
            add("cycle.closesOn", "Give the dates the cycle opens and closes, the close not before the opening.");
        }
        if (cycle.RequiredSignOffs is int required && required < 1)
        {
            add("cycle.requiredSignOffs", "At least one sign-off is required.");
        }
        if (cycle.LaterYearLimits?.Any(l => l < 0) == true)
        {
            add("cycle.laterYearLimits", "A later year's limit is zero or more.");
        }
    }
}
