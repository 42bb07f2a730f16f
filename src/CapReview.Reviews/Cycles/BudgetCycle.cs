namespace CapReview.Reviews.Cycles;

/// <summary>A review round: its capital limit, the MARR version it is pinned to, its dates and status.</summary>
public sealed class BudgetCycle
{
    public int Id { get; set; }

    public required string Name { get; set; }

    /// <summary>Capital that may be committed in the cycle, in the organisation's currency.</summary>
    public decimal CapitalLimit { get; set; }

    /// <summary>The MARR policy version every evaluation in the cycle uses; later policy versions do not change it.</summary>
    public int MarrPolicyVersionId { get; set; }

    public DateOnly OpensOn { get; set; }

    public DateOnly ClosesOn { get; set; }

    public CycleStatus Status { get; set; } = CycleStatus.Open;

    /// <summary>Board sign-offs the cycle's decision needs.</summary>
    public int RequiredSignOffs { get; set; } = 2;

    /// <summary>A board-set study period in years for the ranking, or null to rank by annual worth over each life.</summary>
    public int? StudyPeriodYears { get; set; }

    /// <summary>Capital limits for budget years 1, 2, … of a multi-year budget; year 0 is <see cref="CapitalLimit"/>.</summary>
    public List<decimal> LaterYearLimits { get; set; } = [];

    public Portfolio.SelectionObjective Objective { get; set; } = Portfolio.SelectionObjective.PresentWorth;

    public int Revision { get; set; }
}
