using CapReview.Engine.Comparison;
using CapReview.Reviews.Access;
using CapReview.Reviews.Runs;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Selects the cycle's funded portfolio: every ranked proposal a candidate with its first cost, later capital and
/// worth on one fair basis for unequal lives (<see cref="SelectionWorths"/>); at most one per exclusive group (exactly
/// one for a mandatory group); dependents only with their prerequisites; within the capital limit now and the limits of
/// later budget years.
/// </summary>
public sealed class PortfolioService(CycleRankingService rankings, RunLimiter limiter)
{
    public static readonly TimeSpan SolverTimeLimit = TimeSpan.FromSeconds(10);
    private static readonly TimeSpan FrontierTimeLimit = TimeSpan.FromSeconds(2);
    private const int FrontierSteps = 12;

    /// <summary>
    /// The portfolio a person asks for (the API, the downloads): read, then solved as one of their runs, counted by the
    /// <see cref="RunLimiter"/> and stopped when <paramref name="cancellationToken"/> is cancelled.
    /// </summary>
    public async Task<PortfolioResult> SelectAsync(Actor actor, int cycleId, PortfolioQuery query, CancellationToken cancellationToken)
    {
        CheckQuery(query);
        CycleRankingInputs inputs = await rankings.LoadAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        return await SolveAsync(actor, inputs, query, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The portfolio of a decided cycle for its record (the packets): the same figures, outside the people's limits.</summary>
    public async Task<PortfolioResult> SelectForRecordAsync(Actor actor, int cycleId, PortfolioQuery query, CancellationToken cancellationToken)
    {
        CheckQuery(query);
        CycleRankingInputs inputs = await rankings.LoadAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        return await Task.Run(() => Select(inputs, query, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The portfolio from inputs already read (the portfolio page), as one of <paramref name="actor"/>'s runs, off the caller's thread.</summary>
    public async Task<PortfolioResult> SolveAsync(Actor actor, CycleRankingInputs inputs, PortfolioQuery query, CancellationToken cancellationToken)
    {
        CheckQuery(query);
        using RunLease lease = limiter.Enter(actor);
        return await Task.Run(() => Select(inputs, query, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>
    /// The portfolio computed from inputs already read; reads nothing, but runs the solver (up to
    /// <see cref="SolverTimeLimit"/>, then the frontier), so callers on a UI thread run it elsewhere.
    /// </summary>
    public static PortfolioResult Select(CycleRankingInputs inputs, PortfolioQuery query, CancellationToken cancellationToken)
    {
        CheckQuery(query);
        CycleRanking ranking = CycleRankingService.Rank(inputs, query.MarrShift, query.AfterTax);
        SelectionObjective objective = query.Objective ?? ranking.Cycle.Objective;
        var (problem, excluded, basis) = ProblemOf(ranking, (double)(query.CapitalLimit ?? ranking.Cycle.CapitalLimit), objective);
        Selection optimal = CapitalSelection.Optimal(problem, SolverTimeLimit, cancellationToken);
        Selection greedy = CapitalSelection.Greedy(problem);
        // Up to what every worthwhile proposal and the dearest way of meeting each mandatory group would need together.
        double mandatory = (problem.MandatoryGroups ?? []).Sum(g => problem.Candidates.Where(c => g.Contains(c.Id)).Max(c => c.FirstCost));
        double top = Math.Max(problem.CapitalLimit, problem.Candidates.Where(c => c.Worth > 0).Sum(c => c.FirstCost) + mandatory);
        var limits = Enumerable.Range(0, FrontierSteps + 1).Select(k => Math.Round(top * k / FrontierSteps, 2))
            .Append(problem.CapitalLimit).Distinct().Order();
        var frontier = CapitalSelection.Frontier(problem, limits, FrontierTimeLimit, cancellationToken).Select(f => new FrontierPoint(f.Limit, f.Selection)).ToList();
        return new PortfolioResult(ranking, problem, objective, optimal, greedy, frontier, excluded) { WorthBasis = basis };
    }

    private static void CheckQuery(PortfolioQuery query)
    {
        ArgumentNullException.ThrowIfNull(query);
        if (query.CapitalLimit is < 0m)
        {
            throw new Common.RuleViolationException("capitalLimit: the capital limit cannot be negative.");
        }
    }

    /// <summary>
    /// The cycle's rules as a selection problem over the ranked proposals, each worth what <see cref="SelectionWorths"/>
    /// gives it on the one fair basis for unequal lives, and that basis in words.
    /// </summary>
    public static (SelectionProblem Problem, IReadOnlyList<(string Reference, string Reason)> Excluded, string Basis) ProblemOf(CycleRanking ranking, double capitalLimit,
        SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        SelectionWorths worths = SelectionWorths.Of(ranking, objective);
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
            worths.Worth[r.Proposal.Reference],
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
        return (problem, excluded, worths.Basis);
    }
}
