using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Components.Ranking;

/// <summary>A column of the ranking table: its key in the address and memory, its heading, and the value it sorts by.</summary>
public sealed record RankingColumn(string Key, string Title, bool Numeric, Func<RankingRow, IComparable?> Value);
