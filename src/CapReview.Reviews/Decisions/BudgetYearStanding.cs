using System.Globalization;

namespace CapReview.Reviews.Decisions;

/// <summary>The first cost the approved proposals need in one budget year, against that year's capital limit.</summary>
/// <param name="Year">0 for the cycle's own year, 1, 2, … for the later years of its multi-year plan.</param>
/// <param name="Approved">The capital the approved proposals need in that year.</param>
/// <param name="Limit">The year's capital limit.</param>
public sealed record BudgetYearStanding(int Year, double Approved, double Limit)
{
    /// <summary>Half a currency unit of tolerance: figures are shown to whole units.</summary>
    public bool Over => Approved > Limit + 0.5;

    public string Name => Year == 0 ? "the cycle's budget year" : $"budget year {Year.ToString(CultureInfo.InvariantCulture)}";

    /// <summary>The limit as a rule, with how the approved cost stands against it.</summary>
    public RuleStanding AsRule() => new($"year:{Year.ToString(CultureInfo.InvariantCulture)}",
        $"The approved first cost stays within the capital limit of {Name}",
        $"{Approved.ToString("N0", CultureInfo.InvariantCulture)} approved against a limit of {Limit.ToString("N0", CultureInfo.InvariantCulture)}",
        Over ? RuleState.Broken : RuleState.Met, Over ? Approved - Limit : 0.0);
}
