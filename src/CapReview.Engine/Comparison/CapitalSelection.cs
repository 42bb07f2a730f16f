using Google.OrTools.Sat;

namespace CapReview.Engine.Comparison;

/// <summary>A proposal as the selection sees it: its first cost and the worth it adds when funded.</summary>
/// <param name="Id">The proposal's reference.</param>
/// <param name="FirstCost">Capital committed now (budget year 0).</param>
/// <param name="Worth">Present or annual worth at the MARR, as the board chose to maximise.</param>
/// <param name="LaterCapital">Capital it needs in budget years 1, 2, … of a multi-year budget (year 0 is the first cost).</param>
public sealed record SelectionCandidate(string Id, double FirstCost, double Worth, IReadOnlyList<double>? LaterCapital = null)
{
    /// <summary>Capital needed in budget year <paramref name="year"/> (0 = now).</summary>
    public double CapitalIn(int year) =>
        year == 0 ? FirstCost : LaterCapital is { } later && year <= later.Count ? later[year - 1] : 0.0;
}

/// <summary>
/// Which proposals may be funded together: a capital limit on what is committed now, optional limits for the later
/// years of a multi-year budget, groups of which at most one may be chosen (exactly one when mandatory), and
/// contingencies (the dependent only with its prerequisite).
/// </summary>
public sealed record SelectionProblem(
    IReadOnlyList<SelectionCandidate> Candidates,
    double CapitalLimit,
    IReadOnlyList<IReadOnlyList<string>> ExclusiveGroups,
    IReadOnlyList<(string Dependent, string Prerequisite)> Contingencies,
    IReadOnlyList<double>? LaterYearLimits = null,
    IReadOnlyList<IReadOnlyList<string>>? MandatoryGroups = null)
{
    /// <summary>The capital limit of budget year <paramref name="year"/> (0 = now).</summary>
    public double LimitIn(int year) => year == 0 ? CapitalLimit : LaterYearLimits![year - 1];

    /// <summary>Budget years with a limit, counting year 0.</summary>
    public int BudgetYears => 1 + (LaterYearLimits?.Count ?? 0);

    internal IEnumerable<(IReadOnlyList<string> Members, bool Mandatory)> Groups =>
        ExclusiveGroups.Select(g => (g, false)).Concat((MandatoryGroups ?? []).Select(g => (g, true)));
}

/// <summary>A chosen set, its total worth and cost now, and whether the solver proved no better set exists.</summary>
/// <param name="Chosen">The funded proposals.</param>
/// <param name="TotalWorth">Their total worth.</param>
/// <param name="TotalCost">Their total first cost.</param>
/// <param name="UpperBound">No allowed set is worth more (the solver's bound; NaN where none).</param>
/// <param name="ProvenOptimal">The solver proved no better set exists; with <paramref name="Feasible"/> false, that no set meets the rules.</param>
/// <param name="Feasible">False when no set meets the rules (a mandatory group that cannot be afforded) or none was found in time.</param>
public sealed record Selection(IReadOnlyList<string> Chosen, double TotalWorth, double TotalCost, bool ProvenOptimal, double UpperBound, bool Feasible = true);

/// <summary>
/// The set of proposals of greatest total worth within the capital limit, exclusive groups and contingencies: a 0-1
/// knapsack with side constraints, solved exactly by Google OR-Tools' CP-SAT solver on amounts in whole cents (coarser
/// units when a cycle's totals in cents would not fit the solver's integers, see <see cref="SelectionUnits"/>). Beside
/// it, the greedy fill by ranking (best worth first, taken while it fits and is allowed) that a ranking alone suggests.
/// </summary>
public static class CapitalSelection
{
    /// <summary>
    /// The set of greatest total worth, proven optimal when the solver finishes within <paramref name="timeLimit"/>;
    /// a cancellation stops the solver's search at once and throws <see cref="OperationCanceledException"/>.
    /// </summary>
    public static Selection Optimal(SelectionProblem problem, TimeSpan timeLimit, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(problem);
        Check(problem);
        cancellationToken.ThrowIfCancellationRequested();
        var units = SelectionUnits.For(problem);
        var model = new CpModel();
        var chosen = problem.Candidates.ToDictionary(c => c.Id, c => model.NewBoolVar(c.Id));
        for (int year = 0; year < problem.BudgetYears; year++)
        {
            model.Add(LinearExpr.WeightedSum(problem.Candidates.Select(c => chosen[c.Id]), problem.Candidates.Select(c => units.Of(c.CapitalIn(year))))
                <= units.Limit(problem, year));
        }
        foreach (var (members, mandatory) in problem.Groups)
        {
            if (mandatory)
            {
                model.AddExactlyOne(members.Select(id => chosen[id]));
            }
            else
            {
                model.AddAtMostOne(members.Select(id => chosen[id]));
            }
        }
        foreach (var (dependent, prerequisite) in problem.Contingencies)
        {
            model.AddImplication(chosen[dependent], chosen[prerequisite]);
        }
        // Only proposals that add worth can help the objective; the others stay out.
        model.Maximize(LinearExpr.WeightedSum(problem.Candidates.Select(c => chosen[c.Id]), problem.Candidates.Select(c => units.Of(c.Worth))));

        var solver = new CpSolver { StringParameters = $"max_time_in_seconds:{timeLimit.TotalSeconds.ToString(System.Globalization.CultureInfo.InvariantCulture)} num_workers:2" };
        CpSolverStatus status;
        using (cancellationToken.Register(solver.StopSearch))
        {
            status = solver.Solve(model);
        }
        cancellationToken.ThrowIfCancellationRequested();
        if (status is not (CpSolverStatus.Optimal or CpSolverStatus.Feasible))
        {
            // Infeasible is proven; an unknown status means the time ran out before any allowed set was found.
            return new Selection([], 0.0, 0.0, status == CpSolverStatus.Infeasible, double.NaN, Feasible: false);
        }
        var set = problem.Candidates.Where(c => solver.BooleanValue(chosen[c.Id])).ToList();
        return new Selection([.. set.Select(c => c.Id)], set.Sum(c => c.Worth), set.Sum(c => c.FirstCost),
            status == CpSolverStatus.Optimal, units.Money(solver.BestObjectiveBound));
    }

    /// <summary>
    /// Down the ranking: the candidates in the order given (the board's ranking; by worth when <paramref name="byWorth"/>),
    /// each taken when it adds worth, fits the remaining capital and breaks no rule; a mandatory group's first member
    /// that fits is taken first, whatever its worth.
    /// </summary>
    public static Selection Greedy(SelectionProblem problem, bool byWorth = false)
    {
        ArgumentNullException.ThrowIfNull(problem);
        Check(problem);
        var units = SelectionUnits.For(problem);
        var taken = new List<SelectionCandidate>();
        var byRank = byWorth
            ? problem.Candidates.OrderByDescending(c => c.Worth).ThenBy(c => c.Id, StringComparer.Ordinal).ToList()
            : [.. problem.Candidates];
        foreach (var group in problem.MandatoryGroups ?? [])
        {
            SelectionCandidate? pick = byRank.FirstOrDefault(c => group.Contains(c.Id) && Fits(problem, units, taken, c) && PrerequisiteTaken(problem, taken, c));
            if (pick is null)
            {
                return new Selection([], 0.0, 0.0, ProvenOptimal: false, double.NaN, Feasible: false);
            }
            taken.Add(pick);
        }
        foreach (SelectionCandidate c in byRank)
        {
            var ids = taken.Select(t => t.Id).Append(c.Id).ToHashSet();
            if (c.Worth > 0.0 && !taken.Contains(c) && Fits(problem, units, taken, c) && Allowed(problem, ids, requireMandatory: false))
            {
                taken.Add(c);
            }
        }
        return new Selection([.. taken.Select(t => t.Id)], taken.Sum(t => t.Worth), taken.Sum(t => t.FirstCost), ProvenOptimal: false, double.NaN,
            Feasible: Allowed(problem, [.. taken.Select(t => t.Id)], requireMandatory: true));
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
        var units = SelectionUnits.For(problem);
        var limits = Enumerable.Range(0, problem.BudgetYears).Select(year => units.Limit(problem, year)).ToArray();
        double bestWorth = double.NegativeInfinity;
        long bestMask = -1;
        for (long mask = 0; mask < 1L << n; mask++)
        {
            double worth = 0.0;
            var ids = new HashSet<string>();
            var cost = new long[problem.BudgetYears];
            for (int k = 0; k < n; k++)
            {
                if ((mask & (1L << k)) != 0)
                {
                    worth += units.Of(problem.Candidates[k].Worth);
                    ids.Add(problem.Candidates[k].Id);
                    for (int year = 0; year < cost.Length; year++)
                    {
                        cost[year] += units.Of(problem.Candidates[k].CapitalIn(year));
                    }
                }
            }
            bool fits = cost.Select((c, year) => c <= limits[year]).All(ok => ok);
            if (fits && worth > bestWorth && Allowed(problem, ids, requireMandatory: true))
            {
                bestWorth = worth;
                bestMask = mask;
            }
        }
        if (bestMask < 0)
        {
            return new Selection([], 0.0, 0.0, true, double.NaN, Feasible: false);
        }
        var set = problem.Candidates.Where((_, k) => (bestMask & (1L << k)) != 0).ToList();
        return new Selection([.. set.Select(c => c.Id)], set.Sum(c => c.Worth), set.Sum(c => c.FirstCost), true, units.Money(bestWorth));
    }

    /// <summary>The optimal total worth at each capital limit: how the selection answers a larger or smaller budget.</summary>
    public static IReadOnlyList<(double Limit, Selection Selection)> Frontier(SelectionProblem problem, IEnumerable<double> limits, TimeSpan timeLimitEach,
        CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(problem);
        ArgumentNullException.ThrowIfNull(limits);
        return [.. limits.Select(limit => (limit, Optimal(problem with { CapitalLimit = limit }, timeLimitEach, cancellationToken)))];
    }

    private static bool Allowed(SelectionProblem problem, HashSet<string> ids, bool requireMandatory) =>
        problem.Groups.All(g => g.Members.Count(ids.Contains) is var count && count <= 1 && (!requireMandatory || !g.Mandatory || count == 1))
        && problem.Contingencies.All(c => !ids.Contains(c.Dependent) || ids.Contains(c.Prerequisite));

    private static bool Fits(SelectionProblem problem, SelectionUnits units, List<SelectionCandidate> taken, SelectionCandidate next) =>
        Enumerable.Range(0, problem.BudgetYears).All(year =>
            taken.Sum(t => units.Of(t.CapitalIn(year))) + units.Of(next.CapitalIn(year)) <= units.Limit(problem, year));

    private static bool PrerequisiteTaken(SelectionProblem problem, List<SelectionCandidate> taken, SelectionCandidate c) =>
        problem.Contingencies.Where(k => k.Dependent == c.Id).All(k => taken.Any(t => t.Id == k.Prerequisite));

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
        if (!double.IsFinite(problem.CapitalLimit) || problem.CapitalLimit < 0
            || (problem.LaterYearLimits ?? []).Any(l => !double.IsFinite(l) || l < 0))
        {
            throw new ArgumentException("Capital limits must be finite and not negative.", nameof(problem));
        }
        if (problem.Candidates.Any(c => (c.LaterCapital ?? []).Any(v => !double.IsFinite(v) || v < 0)))
        {
            throw new ArgumentException("Later capital needs must be finite and not negative.", nameof(problem));
        }
        if (problem.Groups.SelectMany(g => g.Members).Concat(problem.Contingencies.SelectMany(c => new[] { c.Dependent, c.Prerequisite })).Any(id => !ids.Contains(id)))
        {
            throw new ArgumentException("A group or contingency names a candidate that is not in the problem.", nameof(problem));
        }
    }
}
