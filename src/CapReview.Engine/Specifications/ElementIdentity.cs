using System.Text.RegularExpressions;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Specifications;

/// <summary>
/// Element identities and the targets that name an element by one (<c>elements[#id].field</c>) rather than by its
/// position (<c>elements[2].field</c>, the form of documents stored before identities).
/// </summary>
public static partial class ElementIdentity
{
    public const int MaxLength = 40;

    /// <summary>Names each blank, malformed or repeated identity as <c>elements[k].id</c>.</summary>
    public static void Check(IReadOnlyList<ElementSpec?>? elements, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int e = 0; e < (elements?.Count ?? 0); e++)
        {
            if (elements![e]?.Id is not { } id)
            {
                continue;
            }
            if (!Valid().IsMatch(id))
            {
                errors.Add(new($"elements[{e}].id", $"An element's id is 1 to {MaxLength} letters, digits, '-' or '_'."));
            }
            else if (!seen.Add(id))
            {
                errors.Add(new($"elements[{e}].id", $"Another element already has the id “{id}”."));
            }
        }
    }

    /// <summary>The target naming the element with <paramref name="id"/>: <c>elements[#id].field</c>.</summary>
    public static string Target(string id, string field) => $"elements[#{id}].{field}";

    /// <summary>The identity and field of a target such as <c>elements[#k7f2].amount</c>, or null for any other target.</summary>
    public static (string Id, string Field)? Parse(string target)
    {
        ArgumentNullException.ThrowIfNull(target);
        Match m = IdentityTarget().Match(target);
        return m.Success ? (m.Groups[1].Value, m.Groups[2].Value) : null;
    }

    /// <summary>
    /// The positional form of <paramref name="target"/> in <paramref name="elements"/> (other targets unchanged), or
    /// null when it names an element that is not there: never another element.
    /// </summary>
    public static string? Resolve(string target, IReadOnlyList<ElementSpec?>? elements)
    {
        if (Parse(target) is not var (id, field))
        {
            return target;
        }
        for (int e = 0; e < (elements?.Count ?? 0); e++)
        {
            if (elements![e]?.Id == id)
            {
                return $"elements[{e}].{field}";
            }
        }
        return null;
    }

    [GeneratedRegex(@"^[A-Za-z0-9_-]{1,40}$")]
    private static partial Regex Valid();

    [GeneratedRegex(@"^elements\[#([A-Za-z0-9_-]{1,40})\]\.(amount|step|growth|escalation|first|last|period)$")]
    private static partial Regex IdentityTarget();
}
