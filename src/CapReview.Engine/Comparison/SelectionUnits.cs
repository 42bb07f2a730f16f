namespace CapReview.Engine.Comparison;

/// <summary>
/// The whole units a selection problem's money is counted in for the solver: cents, or the smallest power of ten above
/// them that keeps every sum the solver forms (the total worth, each year's capital) within 10^18, so that its 64-bit
/// integers never overflow. A cycle of ordinary proposals stays in cents; one whose amounts reach the models' limits
/// (flows of 10^15 over 1,200 periods) is counted in coarser units, where a cent is no longer a meaningful difference.
/// </summary>
internal readonly record struct SelectionUnits(double Unit)
{
    private const double Largest = 1e18;

    public static SelectionUnits For(SelectionProblem problem)
    {
        double largest = problem.Candidates.Sum(c => Math.Abs(c.Worth));
        for (int year = 0; year < problem.BudgetYears; year++)
        {
            int y = year;
            largest = Math.Max(largest, problem.Candidates.Sum(c => c.CapitalIn(y)));
        }
        double unit = 0.01;
        while (largest / unit > Largest)
        {
            unit *= 10.0;
        }
        return new SelectionUnits(unit);
    }

    /// <summary>An amount in whole units, rounded half away from zero.</summary>
    public long Of(double amount) => (long)Math.Round(amount / Unit, MidpointRounding.AwayFromZero);

    /// <summary>
    /// A year's limit in whole units, rounded down; a limit above every candidate's capital that year together is
    /// no limit, and is counted as just above that sum (a limit of 10^300 must not pass the integers' range).
    /// </summary>
    public long Limit(SelectionProblem problem, int year)
    {
        long all = 0;
        foreach (SelectionCandidate c in problem.Candidates)
        {
            all += Of(c.CapitalIn(year));
        }
        double limit = problem.LimitIn(year);
        return limit / Unit >= all ? all + 1 : (long)Math.Floor(limit / Unit + 1e-6);
    }

    /// <summary>A sum of whole units back in money.</summary>
    public double Money(double units) => units * Unit;
}
