namespace CapReview.Engine.Comparison;

/// <summary>The ranked proposals, and those that could not be evaluated on the ranking's basis.</summary>
public sealed record RankingOutcome(IReadOnlyList<RankedProposal> Ranked, IReadOnlyList<UnevaluableEntry> Unevaluable);
