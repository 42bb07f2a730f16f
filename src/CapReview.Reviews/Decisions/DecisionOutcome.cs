namespace CapReview.Reviews.Decisions;

/// <summary>What the board decides on a proposal.</summary>
public enum DecisionOutcome
{
    Approve,
    ReturnForChanges,
    Reject,
}
