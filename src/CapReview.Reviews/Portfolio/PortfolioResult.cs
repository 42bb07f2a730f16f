using CapReview.Engine.Comparison;

namespace CapReview.Reviews.Portfolio;

/// <summary>The funded portfolio: the optimal set, the greedy fill by ranking beside it, and the frontier.</summary>
/// <param name="Ranking">The ranking the selection was made from.</param>
/// <param name="Problem">The selection problem as the solver saw it.</param>
/// <param name="Objective">What was maximised.</param>
/// <param name="Optimal">The set of greatest total worth within the rules.</param>
/// <param name="Greedy">The fill by ranking, for comparison.</param>
/// <param name="Frontier">The best total worth at capital limits from zero to all worthwhile proposals.</param>
/// <param name="Excluded">Proposals left out before selecting, with the reason.</param>
public sealed record PortfolioResult(CycleRanking Ranking, SelectionProblem Problem, SelectionObjective Objective, Selection Optimal, Selection Greedy,
    IReadOnlyList<FrontierPoint> Frontier, IReadOnlyList<(string Reference, string Reason)> Excluded)
{
    /// <summary>
    /// Every proposal of the cycle that takes no part in the selection, with the reason: those the ranking could not
    /// rank (an unevaluable one among them), then those left out before selecting.
    /// </summary>
    public IReadOnlyList<UnrankedProposal> LeftOut =>
        [.. Ranking.Unranked, .. Excluded.Select(e => new UnrankedProposal(Ranking.Rows.First(r => r.Proposal.Reference == e.Reference).Proposal, e.Reason))];

    /// <summary>The basis every candidate's worth is on, in words (<see cref="SelectionWorths"/>).</summary>
    public string WorthBasis { get; init; } = "";

    /// <summary>How much more the optimal set is worth than the greedy fill.</summary>
    public double Advantage => Optimal.TotalWorth - Greedy.TotalWorth;
}
