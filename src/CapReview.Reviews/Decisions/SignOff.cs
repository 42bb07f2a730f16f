namespace CapReview.Reviews.Decisions;

/// <summary>
/// A board member's sign-off of a cycle's decisions: who, when, and exactly which decisions on which versions
/// (<see cref="DecisionsSigned"/>: proposal reference, version, assumptions hash and outcome of each). Written once.
/// </summary>
public sealed class SignOff
{
    public int Id { get; set; }

    public int BudgetCycleId { get; set; }

    public required string UserId { get; set; }

    public required string DisplayName { get; set; }

    public DateTimeOffset SignedAt { get; set; }

    public required string DecisionsSigned { get; set; }
}
