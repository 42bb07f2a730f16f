namespace CapReview.Engine.Depreciation;

/// <summary>
/// Depreciation by tax year (year 1 is the year the asset is placed in service) and the book value at the end of
/// each year, from the depreciable basis.
/// </summary>
/// <param name="Basis">The depreciable basis (cost).</param>
/// <param name="Amounts">Depreciation of tax years 1, 2, ….</param>
/// <param name="Method">The method in words, as schedules and packets state it.</param>
public sealed record DepreciationSchedule(double Basis, IReadOnlyList<double> Amounts, string Method)
{
    /// <summary>Book value at the end of tax year <paramref name="year"/> (0: the basis).</summary>
    public double BookValueAfter(int year)
    {
        double value = Basis;
        for (int k = 0; k < Math.Min(year, Amounts.Count); k++)
        {
            value -= Amounts[k];
        }
        return value;
    }

    /// <summary>Each year's depreciation as a fraction of the basis (the percentages of published tables).</summary>
    public IReadOnlyList<double> Rates => [.. Amounts.Select(a => Basis == 0 ? 0 : a / Basis)];

    /// <summary>
    /// The schedule of an asset disposed of in tax year <paramref name="year"/>: the years after it are dropped and the
    /// disposal year's amount is multiplied by <paramref name="disposalYearShare"/> (the method's rule for that year:
    /// 1 for the book methods, a half under the MACRS half-year convention, and so on).
    /// </summary>
    public DepreciationSchedule DisposedIn(int year, double disposalYearShare)
    {
        if (year < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(year), year, "The disposal year is 1 or later.");
        }
        if (year > Amounts.Count)
        {
            return this;
        }
        var kept = Amounts.Take(year).ToArray();
        kept[^1] *= disposalYearShare;
        return this with { Amounts = kept };
    }
}
