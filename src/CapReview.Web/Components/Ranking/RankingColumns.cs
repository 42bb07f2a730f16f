using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Components.Ranking;

/// <summary>The ranking table's columns, and the rows as the user filtered and sorted them.</summary>
public static class RankingColumns
{
    public static IReadOnlyList<RankingColumn> All { get; } =
    [
        new("rank", "Rank", true, r => r.Ranked.Rank),
        new("proposal", "Proposal", false, r => r.Proposal.Reference),
        new("aw", "AW per year", true, r => r.Ranked.AnnualWorth),
        new("pw", "PW", true, r => r.Ranked.PresentWorth),
        new("irr", "Rate of return", true, r => r.Ranked.Evaluation.UniqueRateOfReturn),
        new("err", "External rate", true, r => r.Ranked.Evaluation.ExternalRate),
        new("payback", "Discounted payback, years", true, r => r.Ranked.Evaluation.DiscountedPaybackYears),
        new("bc", "B/C", true, r => r.Ranked.Evaluation.BenefitCost.Conventional),
        new("cost", "First cost", true, r => r.Ranked.FirstCost),
        new("life", "Life, years", true, r => r.Ranked.LifeYears),
        new("marr", "MARR", true, r => r.Marr.EffectiveAnnual()),
        new("category", "Category", false, r => r.Proposal.Category.ToString()),
        new("risk", "Risk", false, r => r.Proposal.RiskClass),
        new("basis", "Basis", false, r => r.Ranked.Basis),
        new("rules", "Group and needs", false, r => r.Group?.Name),
    ];

    public static bool Knows(string key) => All.Any(c => c.Key == key);

    /// <summary>The rows of the category and risk class chosen ("" for all), sorted by the column.</summary>
    public static List<RankingRow> Shown(IEnumerable<RankingRow> rows, string category, string risk, string sortKey, bool descending)
    {
        var kept = rows.Where(r => (category.Length == 0 || r.Proposal.Category.ToString() == category)
            && (risk.Length == 0 || r.Proposal.RiskClass.ToString() == risk)).ToList();
        RankingColumn column = All.Single(c => c.Key == sortKey);
        // Missing values (no unique rate, never paid back) sort last in either direction.
        var present = kept.Where(r => column.Value(r) is not null);
        var ordered = descending ? present.OrderByDescending(column.Value) : present.OrderBy(column.Value);
        return [.. ordered.ThenBy(r => r.Ranked.Rank), .. kept.Where(r => column.Value(r) is null)];
    }
}
