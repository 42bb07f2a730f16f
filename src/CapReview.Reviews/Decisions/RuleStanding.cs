namespace CapReview.Reviews.Decisions;

/// <summary>One portfolio rule against the decisions so far, in words.</summary>
/// <param name="Key">Identifies the rule across two standings (before and after a decision).</param>
/// <param name="Rule">The rule as the board set it ("At most one of Press line (P-1, P-2) is approved").</param>
/// <param name="Detail">How the decisions stand against it ("approved: P-1, P-2").</param>
/// <param name="State">Kept, still open, or broken.</param>
/// <param name="Excess">For a capital limit, how far the approved first cost goes beyond it; 0 for the other rules.</param>
public sealed record RuleStanding(string Key, string Rule, string Detail, RuleState State, double Excess = 0.0)
{
    /// <summary>The rule and how it is broken, for a refusal or an override's record.</summary>
    public string Words => $"{Rule} ({Detail})";
}
