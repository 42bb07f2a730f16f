namespace CapReview.Reviews.Cycles;

/// <summary>The terms of an open cycle an administrator may correct: its capital limit and its dates.</summary>
public sealed record CycleCorrection(decimal CapitalLimit, DateOnly OpensOn, DateOnly ClosesOn)
{
    /// <summary>The cycle's terms as they stand.</summary>
    public static CycleCorrection Of(BudgetCycle cycle)
    {
        ArgumentNullException.ThrowIfNull(cycle);
        return new(cycle.CapitalLimit, cycle.OpensOn, cycle.ClosesOn);
    }
}
