using System.Globalization;
using CapReview.Reviews.Common;

namespace CapReview.Web.Components.Admin;

/// <summary>
/// The administrator forms' fields as typed: each number read in the organisation's culture, and each refusal kept
/// beside its field in the person's words ("Capital limit: give a number"), never a field name from the code. A form
/// saves only when <see cref="Any"/> is false, so a refused form creates nothing.
/// </summary>
public sealed class FormFields(CultureInfo culture)
{
    private readonly Dictionary<string, string> _errors = new(StringComparer.Ordinal);
    private readonly Dictionary<string, string> _labels = new(StringComparer.Ordinal);

    public bool Any => _errors.Count > 0;

    public string? this[string field] => _errors.GetValueOrDefault(field);

    /// <summary>"true" for a field with an error, for aria-invalid; null otherwise (the attribute is left out).</summary>
    public string? Invalid(string field) => _errors.ContainsKey(field) ? "true" : null;

    public void Clear() => _errors.Clear();

    /// <summary>A decimal number, or null with "<paramref name="label"/>: give a number" at the field (blank refused unless <paramref name="optional"/>).</summary>
    public double? Number(string field, string label, string text, bool optional = false) =>
        Read<double>(field, label, text, optional, t => double.TryParse(t, NumberStyles.Float, culture, out double v) && double.IsFinite(v) ? v : null);

    /// <summary>An amount of money, as <see cref="Number"/>.</summary>
    public decimal? Money(string field, string label, string text) =>
        Read<decimal>(field, label, text, false, t => decimal.TryParse(t, NumberStyles.Number, culture, out decimal v) ? v : null);

    /// <summary>A whole number, or null with "<paramref name="label"/>: give a whole number" at the field.</summary>
    public int? Whole(string field, string label, string text)
    {
        _labels[field] = label;
        if (int.TryParse(text.Trim(), NumberStyles.Integer, culture, out int value))
        {
            return value;
        }
        _errors[field] = $"{label}: give a whole number";
        return null;
    }

    /// <summary>
    /// Places a domain refusal (its <see cref="RuleViolationException.Field"/>, e.g. capitalLimit) at the field it names, in the
    /// field's own words, and returns true; returns false for a refusal that names no field of this form.
    /// </summary>
    public bool Place(ReviewException refusal, IReadOnlyDictionary<string, string> domainFields)
    {
        ArgumentNullException.ThrowIfNull(refusal);
        ArgumentNullException.ThrowIfNull(domainFields);
        // The domain keeps the field a refusal names beside its message, which already reads in words ("Capital limit: …").
        int colon = refusal.Message.IndexOf(": ", StringComparison.Ordinal);
        if (refusal is not RuleViolationException { Field: { } named } || colon <= 0 || !domainFields.TryGetValue(named, out string? field))
        {
            return false;
        }
        string reason = refusal.Message[(colon + 2)..];
        string label = _labels.GetValueOrDefault(field, "");
        _errors[field] = label.Length > 0 ? $"{label}: {reason}" : char.ToUpper(reason[0], culture) + reason[1..];
        return true;
    }

    /// <summary>Notes an error of the form's own at a field.</summary>
    public void Refuse(string field, string message) => _errors[field] = message;

    private T? Read<T>(string field, string label, string text, bool optional, Func<string, T?> parse)
        where T : struct
    {
        _labels[field] = label;
        string trimmed = (text ?? "").Trim();
        if (trimmed.Length == 0 && optional)
        {
            return null;
        }
        T? value = trimmed.Length == 0 ? null : parse(trimmed);
        if (value is null)
        {
            _errors[field] = $"{label}: give a number";
        }
        return value;
    }
}
