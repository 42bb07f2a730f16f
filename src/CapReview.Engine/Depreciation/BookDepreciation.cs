namespace CapReview.Engine.Depreciation;

/// <summary>
/// The book methods of depreciation over a life of N years to a salvage value S, from a basis B (common practice,
/// no source; checked against <c>Microsoft.VisualBasic.Financial.SLN</c>, <c>DDB</c> and <c>SYD</c>).
/// </summary>
public static class BookDepreciation
{
    /// <summary>(B − S) / N each year.</summary>
    public static DepreciationSchedule StraightLine(double basis, double salvage, int life)
    {
        Check(basis, salvage, life);
        return new(basis, [.. Enumerable.Repeat((basis - salvage) / life, life)], $"straight line over {life} years to a salvage of {salvage:0.##}");
    }

    /// <summary>
    /// A fixed share <paramref name="factor"/>/N of the book value each year (2 for double declining balance, 1.5 for
    /// 150 %), never below the salvage; with <paramref name="switchToStraightLine"/> the year's straight-line amount
    /// over the remaining life is taken whenever it is larger, so the book value reaches the salvage at the end.
    /// </summary>
    public static DepreciationSchedule DecliningBalance(double basis, double salvage, int life, double factor, bool switchToStraightLine)
    {
        Check(basis, salvage, life);
        if (!(factor > 0) || factor > life)
        {
            throw new ArgumentOutOfRangeException(nameof(factor), factor, "The declining-balance factor must be above 0 and at most the life.");
        }
        double rate = factor / life, value = basis;
        var amounts = new double[life];
        for (int t = 0; t < life; t++)
        {
            double declining = value * rate;
            double straight = (value - salvage) / (life - t);
            double amount = switchToStraightLine ? Math.Max(declining, straight) : declining;
            amount = Math.Max(0, Math.Min(amount, value - salvage));
            amounts[t] = amount;
            value -= amount;
        }
        string percent = (factor * 100).ToString("0.##", System.Globalization.CultureInfo.InvariantCulture);
        return new(basis, amounts, $"{percent} % declining balance over {life} years{(switchToStraightLine ? ", switching to straight line" : "")}, salvage {salvage:0.##}");
    }

    /// <summary>(N − t + 1) / (N (N + 1) / 2) of (B − S) in year t.</summary>
    public static DepreciationSchedule SumOfYearsDigits(double basis, double salvage, int life)
    {
        Check(basis, salvage, life);
        double digits = life * (life + 1) / 2.0;
        return new(basis, [.. Enumerable.Range(1, life).Select(t => (basis - salvage) * (life - t + 1) / digits)], $"sum of the years' digits over {life} years to a salvage of {salvage:0.##}");
    }

    /// <summary>(B − S) in proportion to the units produced each year out of the total expected.</summary>
    public static DepreciationSchedule UnitsOfProduction(double basis, double salvage, double totalUnits, IReadOnlyList<double> unitsByYear)
    {
        ArgumentNullException.ThrowIfNull(unitsByYear);
        Check(basis, salvage, Math.Max(1, unitsByYear.Count));
        if (!(totalUnits > 0) || unitsByYear.Any(u => !(u >= 0)) || unitsByYear.Sum() > totalUnits * (1 + 1e-12))
        {
            throw new ArgumentOutOfRangeException(nameof(totalUnits), totalUnits, "Units must not be negative and may not add up to more than the total expected.");
        }
        return new(basis, [.. unitsByYear.Select(u => (basis - salvage) * u / totalUnits)], $"units of production, {totalUnits:0.##} units in all, salvage {salvage:0.##}");
    }

    private static void Check(double basis, double salvage, int life)
    {
        if (!double.IsFinite(basis) || basis < 0 || !double.IsFinite(salvage) || salvage < 0 || salvage > basis)
        {
            throw new ArgumentOutOfRangeException(nameof(basis), basis, "The basis and salvage must be finite, not negative, and the salvage at most the basis.");
        }
        if (life is < 1 or > 100)
        {
            throw new ArgumentOutOfRangeException(nameof(life), life, "The life is 1 to 100 years.");
        }
    }
}
