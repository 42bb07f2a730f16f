namespace CapReview.Reviews.Risk;

/// <summary>
/// The unit a person types an uncertain input in. A model stores rates as fractions (0.09), but people type every
/// rate in percent (9), in the risk parameters as everywhere else: one rule for the editor, the tables and the API's
/// labels, so that a MARR of "9" is never read as 900 %.
/// </summary>
public static class RiskUnits
{
    /// <summary>Whether the input at <paramref name="target"/> is a rate (the MARR, inflation, a tax rate, a growth or escalation).</summary>
    public static bool IsRate(string? target) =>
        target is "rate" or "inflation.rate" or "tax.incomeTaxRate"
        || (target is not null && (target.EndsWith(".growth", StringComparison.Ordinal) || target.EndsWith(".escalation", StringComparison.Ordinal)));

    /// <summary>A stored value as a person types it: rates in percent, other inputs unchanged.</summary>
    public static double Entered(string? target, double stored) => IsRate(target) ? stored * 100 : stored;

    /// <summary>A typed value as stored: rates from percent to a fraction, other inputs unchanged.</summary>
    public static double Stored(string? target, double entered) => IsRate(target) ? entered / 100 : entered;

    /// <summary>The unit's sign after a typed value: "%" for a rate, nothing otherwise.</summary>
    public static string Suffix(string? target) => IsRate(target) ? "%" : "";
}
