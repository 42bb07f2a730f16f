using CapReview.Engine.Depreciation;
using CsCheck;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Depreciation;

/// <summary>The book methods against Microsoft.VisualBasic.Financial's SLN, DDB and SYD.</summary>
public class BookDepreciationTests
{
    [Fact]
    public void Straight_line_matches_Financial_SLN() =>
        Gen.Select(Gen.Double[1_000, 1_000_000], Gen.Double[0, 0.5], Gen.Int[1, 40]).Sample((cost, salvageShare, life) =>
        {
            double salvage = cost * salvageShare;
            var schedule = BookDepreciation.StraightLine(cost, salvage, life);
            return schedule.Amounts.All(a => Math.Abs(a - Financial.SLN(cost, salvage, life)) < 1e-9 * cost) && Math.Abs(schedule.BookValueAfter(life) - salvage) < 1e-6;
        });

    [Fact]
    public void Sum_of_years_digits_matches_Financial_SYD() =>
        Gen.Select(Gen.Double[1_000, 1_000_000], Gen.Double[0, 0.5], Gen.Int[1, 40]).Sample((cost, salvageShare, life) =>
        {
            double salvage = cost * salvageShare;
            var schedule = BookDepreciation.SumOfYearsDigits(cost, salvage, life);
            return Enumerable.Range(1, life).All(t => Math.Abs(schedule.Amounts[t - 1] - Financial.SYD(cost, salvage, life, t)) < 1e-9 * cost);
        });

    [Fact]
    public void Declining_balance_without_the_switch_matches_Financial_DDB_at_any_factor() =>
        // Financial.DDB takes the factor as its last argument and, like the method, never goes below the salvage. Lives
        // from 3 years: for a 2-year life Financial.DDB writes the whole cost off in year 1 whatever the factor.
        Gen.Select(Gen.Double[1_000, 1_000_000], Gen.Double[0, 0.3], Gen.Int[3, 30], Gen.Double[1.0, 2.5]).Sample((cost, salvageShare, life, factor) =>
        {
            double salvage = cost * salvageShare;
            var schedule = BookDepreciation.DecliningBalance(cost, salvage, life, factor, switchToStraightLine: false);
            return Enumerable.Range(1, life).All(t => Math.Abs(schedule.Amounts[t - 1] - Financial.DDB(cost, salvage, life, t, factor)) < 1e-7 * cost);
        });

    [Fact]
    public void The_switch_to_straight_line_reaches_the_salvage_and_never_depreciates_less_than_declining_balance()
    {
        // Common practice, no source: double declining balance on 10,000 over 5 years to nothing switches in year 4,
        // when straight line over the two years left (1,080) exceeds 40 % of 2,160 (864).
        var switched = BookDepreciation.DecliningBalance(10_000, 0, 5, 2.0, switchToStraightLine: true);
        Assert.Equal([4_000, 2_400, 1_440, 1_080, 1_080], switched.Amounts.Select(a => Math.Round(a, 6)));
        Assert.Equal(0, switched.BookValueAfter(5), 9);
        var plain = BookDepreciation.DecliningBalance(10_000, 0, 5, 2.0, switchToStraightLine: false);
        Assert.Equal(777.6, plain.BookValueAfter(5), 9);
        // With a salvage of 1,000 the declining balance stays ahead and stops at the salvage.
        var toSalvage = BookDepreciation.DecliningBalance(10_000, 1_000, 5, 2.0, switchToStraightLine: true);
        Assert.Equal([4_000, 2_400, 1_440, 864, 296], toSalvage.Amounts.Select(a => Math.Round(a, 6)));
    }

    [Fact]
    public void Units_of_production_follows_the_units()
    {
        // Common practice, no source: 90,000 of 100,000 − 10,000 over 45,000 units, 2 per unit.
        var schedule = BookDepreciation.UnitsOfProduction(100_000, 10_000, 45_000, [10_000, 20_000, 15_000]);
        Assert.Equal([20_000, 40_000, 30_000], schedule.Amounts);
        Assert.Equal(10_000, schedule.BookValueAfter(3), 9);
        Assert.Throws<ArgumentOutOfRangeException>(() => BookDepreciation.UnitsOfProduction(100, 0, 10, [6, 6]));
    }
}
