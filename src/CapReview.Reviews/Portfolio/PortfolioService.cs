using CapReview.Engine.Comparison;
using CapReview.Reviews.Access;

namespace CapReview.Reviews.Portfolio;

/// <summary>A what-if on the portfolio: another MARR, another capital limit now, or the other objective.</summary>
public sealed record PortfolioQuery(double MarrShift = 0.0, decimal? CapitalLimit = null, SelectionObjective? Objective = null, bool AfterTax = false);

/// <summary>A point of the efficient frontier: the best total worth at a capital limit.</summary>
public sealed record FrontierPoint(double Limit, Selection Selection);

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
    /// <summary>How much more the optimal set is worth than the greedy fill.</summary>
    public double Advantage => Optimal.TotalWorth - Greedy.TotalWorth;
}

/// <summary>
/// Selects the cycle's funded portfolio: every ranked proposal a candidate with its first cost, later capital and
/// worth on the cycle's basis; at most one per exclusive group (exactly one for a mandatory group); dependents only
/// with their prerequisites; within the capital limit now and the limits of later budget years.
/// </summary>
public sealed class PortfolioService(CycleRankingService rankings)
{
    public static readonly TimeSpan SolverTimeLimit = TimeSpan.FromSeconds(10);
    private static readonly TimeSpan FrontierTimeLimit = TimeSpan.FromSeconds(2);
    private const int FrontierSteps = 12;

    public async Task<PortfolioResult> SelectAsync(Actor actor, int cycleId, PortfolioQuery query, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(query);
        if (query.CapitalLimit is < 0m)
        {
            throw new Common.RuleViolationException("capitalLimit: the capital limit cannot be negative.");
        }
        CycleRanking ranking = await rankings.RankAsync(actor, cycleId, query.MarrShift, cancellationToken, query.AfterTax).ConfigureAwait(false);
        SelectionObjective objective = query.Objective ?? ranking.Cycle.Objective;
        var (problem, excluded) = ProblemOf(ranking, (double)(query.CapitalLimit ?? ranking.Cycle.CapitalLimit), objective);
        Selection optimal = CapitalSelection.Optimal(problem, SolverTimeLimit);
        Selection greedy = CapitalSelection.Greedy(problem);
        // Up to what every worthwhile proposal and the dearest way of meeting each mandatory group would need together.
        double mandatory = (problem.MandatoryGroups ?? []).Sum(g => problem.Candidates.Where(c => g.Contains(c.Id)).Max(c => c.FirstCost));
        double top = Math.Max(problem.CapitalLimit, problem.Candidates.Where(c => c.Worth > 0).Sum(c => c.FirstCost) + mandatory);
        var limits = Enumerable.Range(0, FrontierSteps + 1).Select(k => Math.Round(top * k / FrontierSteps, 2))
            .Append(problem.CapitalLimit).Distinct().Order();
        var frontier = CapitalSelection.Frontier(problem, limits, FrontierTimeLimit).Select(f => new FrontierPoint(f.Limit, f.Selection)).ToList();
        return new PortfolioResult(ranking, problem, objective, optimal, greedy, frontier, excluded);
    }

    /// <summary>The cycle's rules as a selection problem over the ranked proposals.</summary>
    public static (SelectionProblem Problem, IReadOnlyList<(string Reference, string Reason)> Excluded) ProblemOf(CycleRanking ranking, double capitalLimit, SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        var rows = ranking.Rows.ToDictionary(r => r.Proposal.Id);
        var excluded = new List<(string, string)>();
        // A dependent whose prerequisite is not ranked (withdrawn, rejected, not complete) cannot be funded.
        bool dropped;
        do
        {
            dropped = false;
            foreach (var c in ranking.Rules.Contingencies)
            {
                if (rows.TryGetValue(c.DependentProposalId, out RankingRow? dependent) && !rows.ContainsKey(c.PrerequisiteProposalId))
                {
                    excluded.Add((dependent.Proposal.Reference, "its prerequisite is not in the ranking"));
                    rows.Remove(c.DependentProposalId);
                    dropped = true;
                }
            }
        }
        while (dropped);

        int laterYears = ranking.Cycle.LaterYearLimits.Count;
        var candidates = rows.Values.OrderBy(r => r.Ranked.Rank).Select(r => new SelectionCandidate(
            r.Proposal.Reference,
            r.Ranked.FirstCost,
            objective == SelectionObjective.AnnualWorth ? r.Ranked.AnnualWorth : r.Ranked.PresentWorth,
            [.. r.Ranked.LaterCapital.Take(laterYears)])).ToList();
        string Reference(int id) => rows[id].Proposal.Reference;
        IReadOnlyList<string> Members(ExclusiveGroup g) => [.. g.ProposalIds.Where(rows.ContainsKey).Select(Reference)];
        var optional = ranking.Rules.Groups.Where(g => !g.Mandatory).Select(Members).Where(m => m.Count > 1).ToList();
        var mandatory = ranking.Rules.Groups.Where(g => g.Mandatory).Select(Members).Where(m => m.Count > 0).ToList();
        var contingencies = ranking.Rules.Contingencies
            .Where(c => rows.ContainsKey(c.DependentProposalId))
            .Select(c => (Reference(c.DependentProposalId), Reference(c.PrerequisiteProposalId))).ToList();
        var problem = new SelectionProblem(candidates, capitalLimit, optional, contingencies,
            [.. ranking.Cycle.LaterYearLimits.Select(l => (double)l)], mandatory);
        return (problem, excluded);
    }
}
