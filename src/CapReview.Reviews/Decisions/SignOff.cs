namespace CapReview.Reviews.Decisions;

/// <summary>
/// A board member's sign-off of a cycle's decisions: who, when, and exactly which decisions on which versions
/// (<see cref="DecisionsSigned"/>: proposal reference, version, assumptions hash and outcome of each). Written once;
/// the service makes one through <see cref="Cycles.BudgetCycle.SignOff"/>.
/// </summary>
public sealed class SignOff
{
    private SignOff()
    {
    }

    public SignOff(int budgetCycleId, string userId, string displayName, DateTimeOffset signedAt, string decisionsSigned)
    {
        BudgetCycleId = budgetCycleId;
        UserId = userId;
        DisplayName = displayName;
        SignedAt = signedAt;
        DecisionsSigned = decisionsSigned;
    }

    public int Id { get; private set; }

    public int BudgetCycleId { get; private set; }

    public string UserId { get; private set; } = "";

    public string DisplayName { get; private set; } = "";

    public DateTimeOffset SignedAt { get; private set; }

    public string DecisionsSigned { get; private set; } = "";
}
