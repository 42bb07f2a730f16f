using CapReview.Reviews.Decisions;

namespace CapReview.Web.Components;

/// <summary>
/// A board member's decision on one proposal as being entered, kept across reloads of the cycle. No outcome is chosen
/// until the member chooses one.
/// </summary>
public sealed class DecisionEntry
{
    public DecisionOutcome? Outcome { get; set; }

    public string Conditions { get; set; } = "";
}
