namespace CapReview.Reviews.Decisions;

/// <summary>
/// A cycle's decisions as they stand against the board's own rules: the approved first cost of every budget year
/// against its capital limit, and each exclusive group, mandatory group and prerequisite.
/// </summary>
public sealed record DecisionStanding(IReadOnlyList<BudgetYearStanding> Years, IReadOnlyList<RuleStanding> Rules)
{
    /// <summary>Every limit and rule the decisions break now.</summary>
    public IReadOnlyList<RuleStanding> Broken =>
        [.. Years.Where(y => y.Over).Select(y => y.AsRule()), .. Rules.Where(r => r.State == RuleState.Broken)];

    /// <summary>
    /// What this standing breaks that <paramref name="before"/> did not, or breaks further (a limit exceeded by more):
    /// the part a decision that moved from one to the other is answerable for.
    /// </summary>
    public IReadOnlyList<RuleStanding> BrokenSince(DecisionStanding before)
    {
        ArgumentNullException.ThrowIfNull(before);
        var earlier = before.Broken.ToDictionary(b => b.Key);
        return [.. Broken.Where(b => !earlier.TryGetValue(b.Key, out RuleStanding? was) || b.Excess > was.Excess + 0.5)];
    }
}
