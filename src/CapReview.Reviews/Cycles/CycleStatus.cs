namespace CapReview.Reviews.Cycles;

/// <summary>Where a budget cycle stands.</summary>
public enum CycleStatus
{
    Open,
    InReview,
    Decided,
    Closed,
}
