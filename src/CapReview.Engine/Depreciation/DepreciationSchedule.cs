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
    /// The share of the schedule's last tax year that its recovery period covers (1 for the book methods; under MACRS
    /// the part-year its convention leaves for the last year, e.g. a half for half-year property).
    /// </summary>
    public double LastYearShare { get; init; } = 1.0;

    /// <summary>
    /// Whether an asset disposed of in the tax year it was placed in service deducts anything that year (true for the
    /// book methods; false under MACRS).
    /// </summary>
    public bool DeductsWhenDisposedInFirstYear { get; init; } = true;

    /// <summary>
    /// The schedule of an asset disposed of in tax year <paramref name="year"/>: the years after it are dropped and the
    /// disposal year's amount is cut to <paramref name="disposalYearShare"/> of a full year (the method's rule for that
    /// year: 1 for the book methods, a half under the MACRS half-year convention, and so on). In the schedule's last
    /// year the amount already covers only <see cref="LastYearShare"/> of the year: it is taken in full when the
    /// disposal falls at or after the end of the recovery period, and in proportion otherwise.
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
        if (year == 1 && !DeductsWhenDisposedInFirstYear)
        {
            // IRS Publication 946: property placed in service and disposed of in the same year is not depreciated
            // (from memory).
            kept[0] = 0;
            return this with { Amounts = kept };
        }
        // IRS Publication 946 cuts the year of disposal to the convention's share only for property disposed of before
        // the end of its recovery period. The table's last percentage is already that part-year (7.41 % of 3-year
        // half-year property in year 4, Table A-1), so a disposal at or after the end of the recovery takes it whole
        // and leaves no book value; only a disposal earlier in that year (a quarter or month before the recovery
        // ends) keeps the straight-line part of it up to the disposal.
        // (The shares are sums of twelfths: a ratio a rounding short of 1 is 1.)
        double share = year == Amounts.Count ? disposalYearShare / LastYearShare : disposalYearShare;
        kept[^1] *= share >= 1 - 1e-9 ? 1 : share;
        return this with { Amounts = kept };
    }
}
