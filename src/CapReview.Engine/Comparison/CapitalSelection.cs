using Google.OrTools.Sat;

namespace CapReview.Engine.Comparison;

/// <summary>A proposal as the selection sees it: its first cost and the worth it adds when funded.</summary>
public sealed record SelectionCandidate(string Id, double FirstCost, double Worth);

/// <summary>
/// Which proposals may be funded together: a capital limit, groups of which at most one may be chosen, and
/// contingencies (the dependent only with its prerequisite).
/// </summary>
public sealed record SelectionProblem(
    IReadOnlyList<SelectionCandidate> Candidates,
    double CapitalLimit,
    IReadOnlyList<IReadOnlyList<string>> ExclusiveGroups,
    IReadOnlyList<(string Dependent, string Prerequisite)> Contingencies);

/// <summary>A chosen set, its total worth and cost, and whether the solver proved no better set exists.</summary>
public sealed record Selection(IReadOnlyList<string> Chosen, double TotalWorth, double TotalCost, bool ProvenOptimal, double UpperBound);

/// <summary>
/// The set of proposals of greatest total worth within the capital limit, exclusive groups and contingencies: a 0-1
/// knapsack with side constraints, solved exactly by Google OR-Tools' CP-SAT solver on amounts in whole cents. Beside
/// it, the greedy fill by ranking (best worth first, taken while it fits and is allowed) that a ranking alone suggests.
/// </summary>
public static class CapitalSelection
{
    private const double Cents = 100.0;

    public static Selection Optimal(SelectionProblem problem, TimeSpan timeLimit)
    {
        ArgumentNullException.ThrowIfNull(problem);
        Check(problem);
        var model = new CpModel();
        var chosen = problem.Candidates.ToDictionary(c => c.Id, c => model.NewBoolVar(c.Id));
        model.Add(LinearExpr.WeightedSum(problem.Candidates.Select(c => chosen[c.Id]), problem.Candidates.Select(c => ToCents(c.FirstCost)))
            <= (long)Math.Floor(problem.CapitalLimit * Cents));
        foreach (var group in problem.ExclusiveGroups)
        {
            model.AddAtMostOne(group.Select(id => chosen[id]));
        }
        foreach (var (dependent, prerequisite) in problem.Contingencies)
        {
            model.AddImplication(chosen[dependent], chosen[prerequisite]);
        }
        // Only proposals that add worth can help the objective; the others stay out.
        model.Maximize(LinearExpr.WeightedSum(problem.Candidates.Select(c => chosen[c.Id]), problem.Candidates.Select(c => ToCents(c.Worth))));

        var solver = new CpSolver { StringParameters = $"max_time_in_seconds:{timeLimit.TotalSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture)} num_workers:2" };
        CpSolverStatus status = solver.Solve(model);
        if (status is not (CpSolverStatus.Optimal or CpSolverStatus.Feasible))
        {
            return new Selection([], 0.0, 0.0, status == CpSolverStatus.Optimal, solver.BestObjectiveBound / Cents);
        }
        var set = problem.Candidates.Where(c => solver.BooleanValue(chosen[c.Id])).ToList();
        return new Selection([.. set.Select(c => c.Id)], set.Sum(c => c.Worth), set.Sum(c => c.FirstCost),
            status == CpSolverStatus.Optimal, solver.BestObjectiveBound / Cents);
    }

    /// <summary>Best worth first, each taken when it adds worth, fits the remaining capital and breaks no rule.</summary>
    public static Selection Greedy(SelectionProblem problem)
    {
        ArgumentNullException.ThrowIfNull(problem);
        Check(problem);
        var taken = new List<SelectionCandidate>();
        double spent = 0.0;
        foreach (SelectionCandidate c in problem.Candidates.OrderByDescending(c => c.Worth).ThenBy(c => c.Id, StringComparer.Ordinal))
        {
            var ids = taken.Select(t => t.Id).Append(c.Id).ToHashSet();
            if (c.Worth > 0.0 && spent + c.FirstCost <= problem.CapitalLimit && Allowed(problem, ids))
            {
                taken.Add(c);
                spent += c.FirstCost;
            }
        }
        return new Selection([.. taken.Select(t => t.Id)], taken.Sum(t => t.Worth), spent, ProvenOptimal: false, double.NaN);
    }

    /// <summary>Every subset, for checking the solver on small cycles (at most 22 candidates).</summary>
    public static Selection Exhaustive(SelectionProblem problem)
    {
        ArgumentNullException.ThrowIfNull(problem);
        Check(problem);
        int n = problem.Candidates.Count;
        if (n > 22)
        {
            throw new ArgumentOutOfRangeException(nameof(problem), n, "The exhaustive search is for at most 22 candidates.");
        }
        double bestWorth = 0.0;
        long bestMask = 0;
        for (long mask = 1; mask < 1L << n; mask++)
        {
            double cost = 0.0, worth = 0.0;
            var ids = new HashSet<string>();
            for (int k = 0; k < n; k++)
            {
                if ((mask & (1L << k)) != 0)
                {
                    cost += ToCents(problem.Candidates[k].FirstCost);
                    worth += ToCents(problem.Candidates[k].Worth);
                    ids.Add(problem.Candidates[k].Id);
                }
            }
            if (cost <= Math.Floor(problem.CapitalLimit * Cents) && worth > bestWorth && Allowed(problem, ids))
            {
                bestWorth = worth;
                bestMask = mask;
            }
        }
        var set = problem.Candidates.Where((_, k) => (bestMask & (1L << k)) != 0).ToList();
        return new Selection([.. set.Select(c => c.Id)], set.Sum(c => c.Worth), set.Sum(c => c.FirstCost), true, bestWorth / Cents);
    }

    /// <summary>The optimal total worth at each capital limit: how the selection answers a larger or smaller budget.</summary>
    public static IReadOnlyList<(double Limit, Selection Selection)> Frontier(SelectionProblem problem, IEnumerable<double> limits, TimeSpan timeLimitEach)
    {
        ArgumentNullException.ThrowIfNull(problem);
        ArgumentNullException.ThrowIfNull(limits);
        return [.. limits.Select(limit => (limit, Optimal(problem with { CapitalLimit = limit }, timeLimitEach)))];
    }

    private static bool Allowed(SelectionProblem problem, HashSet<string> ids) =>
        problem.ExclusiveGroups.All(g => g.Count(ids.Contains) <= 1)
        && problem.Contingencies.All(c => !ids.Contains(c.Dependent) || ids.Contains(c.Prerequisite));

    private static long ToCents(double amount) => (long)Math.Round(amount * Cents, MidpointRounding.AwayFromZero);

    private static void Check(SelectionProblem problem)
    {
        var ids = problem.Candidates.Select(c => c.Id).ToHashSet();
        if (ids.Count != problem.Candidates.Count)
        {
            throw new ArgumentException("Each candidate needs its own id.", nameof(problem));
        }
        if (problem.Candidates.Any(c => !double.IsFinite(c.FirstCost) || c.FirstCost < 0 || !double.IsFinite(c.Worth)))
        {
            throw new ArgumentException("First costs must be finite and not negative, worths finite.", nameof(problem));
        }
        if (!double.IsFinite(problem.CapitalLimit) || problem.CapitalLimit < 0)
        {
            throw new ArgumentException("The capital limit must be finite and not negative.", nameof(problem));
        }
        if (problem.ExclusiveGroups.SelectMany(g => g).Concat(problem.Contingencies.SelectMany(c => new[] { c.Dependent, c.Prerequisite })).Any(id => !ids.Contains(id)))
        {
            throw new ArgumentException("A group or contingency names a candidate that is not in the problem.", nameof(problem));
        }
    }
}
