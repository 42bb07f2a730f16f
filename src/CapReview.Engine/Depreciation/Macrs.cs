namespace CapReview.Engine.Depreciation;

/// <summary>The MACRS property classes this engine computes.</summary>
public enum MacrsClass
{
    ThreeYear = 3,
    FiveYear = 5,
    SevenYear = 7,
    TenYear = 10,
    FifteenYear = 15,
    TwentyYear = 20,

    /// <summary>Residential rental property, 27.5 years straight line, mid-month.</summary>
    ResidentialRental = 275,

    /// <summary>Nonresidential real property, 39 years straight line, mid-month.</summary>
    Nonresidential = 39,
}

/// <summary>When in the first tax year the property is taken to be placed in service.</summary>
public enum MacrsConvention
{
    HalfYear,
    MidQuarter,
    MidMonth,
}

/// <summary>
/// The U.S. MACRS general depreciation system, computed from its published method rather than read from its tables
/// (IRS Publication 946, "How To Figure the Deduction Without Using the Tables"): 3- to 10-year property at 200 %
/// declining balance and 15- and 20-year property at 150 %, each switching to straight line in the first year that
/// gives as much, over the recovery period with the half-year or mid-quarter convention; residential rental (27.5 years)
/// and nonresidential real property (39 years) straight line with the mid-month convention. Salvage is ignored. The
/// percentages are checked against Publication 946's Appendix A tables in the tests.
/// </summary>
public static class Macrs
{
    /// <summary>The schedule for property placed in service in <paramref name="period"/>: a quarter (1–4) under the mid-quarter convention, a month (1–12) for real property, ignored under the half-year convention.</summary>
    public static DepreciationSchedule Schedule(double basis, MacrsClass propertyClass, MacrsConvention convention, int period = 1)
    {
        if (!double.IsFinite(basis) || basis < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(basis), basis, "The basis must be finite and not negative.");
        }
        bool real = propertyClass is MacrsClass.ResidentialRental or MacrsClass.Nonresidential;
        if (real != (convention == MacrsConvention.MidMonth))
        {
            throw new ArgumentException("Real property uses the mid-month convention; other property the half-year or mid-quarter convention.", nameof(convention));
        }
        double firstYear = convention switch
        {
            MacrsConvention.HalfYear => 0.5,
            MacrsConvention.MidQuarter when period is >= 1 and <= 4 => (12 - 3 * (period - 1) - 1.5) / 12,
            MacrsConvention.MidMonth when period is >= 1 and <= 12 => (12 - (period - 1) - 0.5) / 12,
            _ => throw new ArgumentOutOfRangeException(nameof(period), period, "A quarter is 1 to 4, a month 1 to 12."),
        };
        double recovery = propertyClass switch
        {
            MacrsClass.ResidentialRental => 27.5,
            MacrsClass.Nonresidential => 39,
            _ => (int)propertyClass,
        };
        double factor = real ? 0 : (int)propertyClass >= 15 ? 1.5 : 2.0;
        var amounts = new List<double>();
        double value = basis, used = 0, lastShare = 1;
        while (value > basis * 1e-12)
        {
            double share = amounts.Count == 0 ? firstYear : Math.Min(1, recovery - used);
            double remaining = recovery - used;
            double amount;
            if (remaining <= 1 + 1e-12)
            {
                amount = value;
            }
            else
            {
                double straight = value / remaining * share;
                double declining = factor == 0 ? 0 : value * factor / recovery * share;
                amount = Math.Min(value, Math.Max(straight, declining));
            }
            amounts.Add(amount);
            value -= amount;
            used += share;
            lastShare = share;
        }
        string name = real ? $"MACRS straight line over {recovery:0.#} years, mid-month (month {period})"
            : $"MACRS GDS {(int)propertyClass}-year property, {(factor == 2 ? "200" : "150")} % declining balance switching to straight line, " +
              (convention == MacrsConvention.HalfYear ? "half-year convention" : $"mid-quarter convention (quarter {period})");
        // The recovery period ends part-way through the last year (a half for half-year property): a disposal in that
        // year at or after that point takes the year's amount in full (DepreciationSchedule.DisposedIn).
        return new DepreciationSchedule(basis, amounts, name) { LastYearShare = lastShare, DeductsWhenDisposedInFirstYear = false };
    }

    /// <summary>
    /// The share of a full year's depreciation allowed in the year of disposal before the end of the recovery period
    /// (IRS Publication 946; a disposal in the table's last year at or after the recovery's end takes that year's
    /// percentage in full, see <see cref="DepreciationSchedule.DisposedIn"/>):
    /// a half under the half-year convention; under the mid-quarter convention, up to the middle of the quarter of
    /// disposal; under the mid-month convention, up to the middle of the month of disposal.
    /// </summary>
    public static double DisposalYearShare(MacrsConvention convention, int disposalPeriod) => convention switch
    {
        MacrsConvention.HalfYear => 0.5,
        MacrsConvention.MidQuarter when disposalPeriod is >= 1 and <= 4 => (3 * (disposalPeriod - 1) + 1.5) / 12,
        MacrsConvention.MidMonth when disposalPeriod is >= 1 and <= 12 => (disposalPeriod - 0.5) / 12,
        _ => throw new ArgumentOutOfRangeException(nameof(disposalPeriod), disposalPeriod, "A quarter is 1 to 4, a month 1 to 12."),
    };
}
