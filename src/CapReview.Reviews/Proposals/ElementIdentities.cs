using System.Globalization;
using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Gives every element of a proposal's assumptions a stable identity and points every risk parameter at its element
/// by that identity. Documents stored before identities name elements by position; they are read as they are (a
/// frozen version's text and hash are never rewritten) and take identities only when written again as a draft.
/// </summary>
public static class ElementIdentities
{
    /// <summary>
    /// The assumptions with an id on every element and identity targets in place of positions. An element without an
    /// id takes "e" and its position from 1 (deterministic, so stamping a stored document twice gives the same text);
    /// a positional target whose element is missing is left as it is, so that reading it names the field.
    /// </summary>
    public static ProposalAssumptions Stamp(ProposalAssumptions assumptions)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        IReadOnlyList<ElementSpec?> elements = assumptions.Model.Elements ?? [];
        var parameters = assumptions.Risk?.Parameters ?? [];
        bool positional = parameters.Any(p => p?.Target is { } t && t.StartsWith("elements[", StringComparison.Ordinal) && ElementIdentity.Parse(t) is null);
        if (elements.All(e => e is null || e.Id is not null) && !positional)
        {
            return assumptions;
        }
        var taken = new HashSet<string>(elements.Where(e => e?.Id is not null).Select(e => e!.Id!), StringComparer.Ordinal);
        var stamped = new ElementSpec?[elements.Count];
        for (int k = 0; k < elements.Count; k++)
        {
            stamped[k] = elements[k] is { Id: null } element ? element with { Id = FreeId(k, taken) } : elements[k];
        }
        var model = assumptions.Model with { Elements = assumptions.Model.Elements is null ? null : stamped };
        var risk = assumptions.Risk is { } spec && positional
            ? spec with { Parameters = [.. parameters.Select(p => p is null ? null : p with { Target = ByIdentity(p.Target, stamped) })] }
            : assumptions.Risk;
        return assumptions with { Model = model, Risk = risk };
    }

    /// <summary>A fresh identity for an element a person adds.</summary>
    public static string NewId() => Guid.NewGuid().ToString("N")[..12];

    private static string? ByIdentity(string? target, ElementSpec?[] elements)
    {
        for (int k = 0; target is not null && k < elements.Length; k++)
        {
            string prefix = $"elements[{k}].";
            if (target.StartsWith(prefix, StringComparison.Ordinal) && elements[k]?.Id is { } id)
            {
                return ElementIdentity.Target(id, target[prefix.Length..]);
            }
        }
        return target;
    }

    private static string FreeId(int position, HashSet<string> taken)
    {
        string id = "e" + (position + 1).ToString(CultureInfo.InvariantCulture);
        for (int n = 2; !taken.Add(id); n++)
        {
            id = "e" + (position + 1).ToString(CultureInfo.InvariantCulture) + "-" + n.ToString(CultureInfo.InvariantCulture);
        }
        return id;
    }
}
