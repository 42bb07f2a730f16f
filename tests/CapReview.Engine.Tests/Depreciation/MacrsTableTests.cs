using System.Globalization;
using CapReview.Engine.Depreciation;

namespace CapReview.Engine.Tests.Depreciation;

/// <summary>
/// The MACRS percentages computed from the method against IRS Publication 946, Appendix A (Reference/macrs-pub946.csv;
/// each case names its table). The tables are rounded to two or three decimals of a percent and put the rounding
/// residue into one year (e.g. year 1 of Table A-7a) or alternate the last digit so that each column adds up to 100,
/// so a computed percentage may differ from a two-decimal table by up to 0.015 points (Table A-3's 7-year column cuts
/// year 1 to 17.85 and carries the residue to year 8) and from a three-decimal one by up to 0.004.
/// </summary>
public class MacrsTableTests
{

    internal static readonly Dictionary<(string Table, int Class, int Period), List<double>> Tables = Load();

    private static Dictionary<(string, int, int), List<double>> Load()
    {
        var tables = new Dictionary<(string, int, int), List<double>>();
        foreach (string line in File.ReadLines(Path.Combine(AppContext.BaseDirectory, "Reference", "macrs-pub946.csv")).Where(l => !l.StartsWith('#')).Skip(1))
        {
            string[] f = line.Split(',');
            var key = (f[0], int.Parse(f[1], CultureInfo.InvariantCulture), int.Parse(f[3], CultureInfo.InvariantCulture));
            if (!tables.TryGetValue(key, out var list))
            {
                tables[key] = list = [];
            }
            list.Add(double.Parse(f[5], CultureInfo.InvariantCulture));
        }
        return tables;
    }

    public static TheoryData<string, int, int> Cases()
    {
        var data = new TheoryData<string, int, int>();
        foreach (var (table, cls, period) in Tables.Keys)
        {
            data.Add(table, cls, period);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Computed_percentages_match_IRS_Publication_946(string table, int propertyClass, int period)
    {
        var convention = table switch
        {
            "A-1" => MacrsConvention.HalfYear,
            "A-6" or "A-7a" => MacrsConvention.MidMonth,
            _ => MacrsConvention.MidQuarter,
        };
        var schedule = Macrs.Schedule(100_000, (MacrsClass)propertyClass, convention, Math.Max(1, period));
        var expected = Tables[(table, propertyClass, period)];
        double tolerance = propertyClass is 20 or 275 or 39 ? 0.004 : 0.015;
        var computed = schedule.Rates.Select(r => r * 100).ToList();
        Assert.Equal(expected.Count, computed.Count);
        for (int y = 0; y < expected.Count; y++)
        {
            Assert.True(Math.Abs(expected[y] - computed[y]) <= tolerance, $"Table {table}, class {propertyClass}, period {period}, year {y + 1}: table {expected[y]}, computed {computed[y]:0.0000}");
        }
        Assert.Equal(100.0, computed.Sum(), 9);
        Assert.Equal(0.0, schedule.BookValueAfter(computed.Count), 6);
    }

    [Fact]
    public void The_reference_file_covers_every_class_and_convention_computed() =>
        // Six classes half-year and first quarter; 3-, 5- and 7-year in the second and third quarters (A-3,
        // A-4); 3-, 5-, 7- and 15-year in the fourth; twelve months each of 27.5-year and 39-year (A-7a).
        Assert.Equal(6 + 6 + 3 + 3 + 4 + 12 + 12, Tables.Count);

    [Fact]
    public void Disposal_before_the_end_takes_the_conventions_share_of_that_years_amount()
    {
        // IRS Publication 946, "Property Placed in Service Before the End of the Recovery Period" (from memory): half a
        // year under the half-year convention; to the middle of the quarter or month of disposal otherwise.
        var full = Macrs.Schedule(10_000, MacrsClass.FiveYear, MacrsConvention.HalfYear);
        var sold = full.DisposedIn(3, Macrs.DisposalYearShare(MacrsConvention.HalfYear, 0));
        Assert.Equal([2_000, 3_200, 960], sold.Amounts.Select(a => Math.Round(a, 6)));
        Assert.Equal(10_000 - 6_160, sold.BookValueAfter(3), 6);
        Assert.Equal(4.5 / 12, Macrs.DisposalYearShare(MacrsConvention.MidQuarter, 2), 15);
        Assert.Equal(2.5 / 12, Macrs.DisposalYearShare(MacrsConvention.MidMonth, 3), 15);
    }

    [Fact]
    public void Real_property_refuses_the_half_year_convention() =>
        Assert.Throws<ArgumentException>(() => Macrs.Schedule(1, MacrsClass.Nonresidential, MacrsConvention.HalfYear));
}
