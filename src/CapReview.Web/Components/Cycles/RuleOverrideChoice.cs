namespace CapReview.Web.Components.Cycles;

/// <summary>What a member confirmed: whether to record despite the rules broken, and why.</summary>
public sealed record RuleOverrideChoice(bool Override, string? Reason)
{
    public static RuleOverrideChoice None { get; } = new(false, null);
}
