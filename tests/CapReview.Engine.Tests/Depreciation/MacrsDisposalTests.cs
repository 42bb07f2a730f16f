using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using CapReview.Engine.Taxes;
using CapReview.Engine.Tests.Support;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Depreciation;

/// <summary>
/// The year of disposal under MACRS, against IRS Publication 946: the convention's cut applies to property disposed of
/// before the end of its recovery period; the last percentage of each Appendix A table (Reference/macrs-pub946.csv)
/// is already the convention's part-year, so a disposal at the end of that year takes it in full.
/// </summary>
public class MacrsDisposalTests
{
    private static MacrsConvention ConventionOf(string table) => table switch
    {
        "A-1" => MacrsConvention.HalfYear,
        "A-6" or "A-7a" => MacrsConvention.MidMonth,
        _ => MacrsConvention.MidQuarter,
    };

    public static TheoryData<string, int, int> Cases()
    {
        var data = new TheoryData<string, int, int>();
        foreach (var (table, cls, period) in MacrsTableTests.Tables.Keys)
        {
            data.Add(table, cls, period);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void A_disposal_in_the_tables_last_year_takes_its_percentage_in_full_and_leaves_no_book_value(string table, int propertyClass, int period)
    {
        var convention = ConventionOf(table);
        var published = MacrsTableTests.Tables[(table, propertyClass, period)];
        int last = published.Count;
        var schedule = Macrs.Schedule(100_000, (MacrsClass)propertyClass, convention, Math.Max(1, period));
        // Sold at the end of the last year: the last quarter or month of it (the reader's default), any time under the
        // half-year convention.
        double share = Macrs.DisposalYearShare(convention, convention == MacrsConvention.MidMonth ? 12 : 4);
        var sold = schedule.DisposedIn(last, share);
        double tolerance = propertyClass is 20 or 275 or 39 ? 0.004 : 0.015;
        Assert.Equal(last, sold.Amounts.Count);
        Assert.True(Math.Abs(published[^1] - sold.Amounts[^1] / 1_000) <= tolerance, $"Table {table}, class {propertyClass}, period {period}: last year {sold.Amounts[^1] / 1_000:0.0000} %, table {published[^1]} %");
        Assert.Equal(0, sold.BookValueAfter(last), 6);

        // A year earlier the property is still inside its recovery period: the convention's cut of a full year applies.
        var earlier = schedule.DisposedIn(last - 1, share);
        Assert.True(Math.Abs(published[^2] * share - earlier.Amounts[^1] / 1_000) <= tolerance, $"Table {table}, class {propertyClass}, period {period}: year {last - 1} cut to {earlier.Amounts[^1] / 1_000:0.0000} %");
    }

    [Fact]
    public void Three_year_half_year_property_sold_in_year_4_takes_its_7_41_percent_and_the_whole_resale_is_gain()
    {
        // IRS Publication 946 Table A-1, 3-year: 33.33, 44.45, 14.81, 7.41 %; by the method exactly 1/3, 4/9, 4/27 and
        // 2/27 (hand-computed closed form). Sold for 5,000 at the end of year 4: book value 0, gain 5,000; taxable
        // income of year 4 is 20,000 − 7,407.41 + 5,000 at 25 %.
        var model = Models.Valid(4, 1,
            new SingleAmount("Lathe", Capital, 0, -100_000),
            new UniformSeries("Saved", Revenue, 1, 4, 20_000),
            new SingleAmount("Resale", Salvage, 4, 5_000));
        var schedule = Macrs.Schedule(100_000, MacrsClass.ThreeYear, MacrsConvention.HalfYear);
        var result = AfterTaxAnalysis.Compute(model, new TaxSettings(0.25, schedule, Macrs.DisposalYearShare(MacrsConvention.HalfYear, 0)));
        Assert.Equal(100_000 * 2.0 / 27, result.Rows[4].Depreciation, 6);
        Assert.Equal(0, result.BookValueAtDisposal, 6);
        Assert.Equal(5_000, result.GainOnDisposal, 6);
        Assert.Equal(0.25 * (20_000 - 100_000 * 2.0 / 27 + 5_000), result.Rows[4].Tax, 6);
        Assert.Equal(20_000 + 5_000 - 0.25 * (20_000 - 100_000 * 2.0 / 27 + 5_000), result.Rows[4].AfterTax, 6);
    }

    [Fact]
    public void Nonresidential_real_property_sold_in_year_40_takes_the_last_half_month_and_leaves_no_book_value()
    {
        // IRS Publication 946 Table A-7a, placed in service in January: 2.461 % in year 1, 2.564 % in years 2-39,
        // 0.107 % in year 40 (by the method 0.5/12 of 1/39, hand-computed). Entered as a proposal is: the disposal's
        // month left out, so the reader takes December.
        var model = new ModelSpec
        {
            Horizon = 40,
            PeriodsPerYear = 1,
            Rate = new RateSpec { Value = 0.08 },
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Warehouse", Category = Capital, Period = 0, Amount = -390_000 },
                new ElementSpec { Type = ElementKind.Uniform, Label = "Rent saved", Category = Revenue, First = 1, Last = 40, Amount = 40_000 },
                new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = Salvage, Period = 40, Amount = 100_000 },
            ],
        };
        var tax = new TaxSpec
        {
            IncomeTaxRate = 0.21,
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.Nonresidential, PlacedInPeriod = 1 },
        };
        var outcome = AfterTaxEvaluator.Evaluate(model, tax);
        Assert.True(outcome.IsValid, string.Join("; ", outcome.Errors.Select(e => e.Field + ": " + e.Message)));
        var table = outcome.Value!.Table;
        Assert.Equal(390_000 * 0.5 / 12 / 39, table.Rows[40].Depreciation, 6);
        Assert.Equal(0, table.BookValueAtDisposal, 6);
        Assert.Equal(100_000, table.GainOnDisposal, 6);
    }

    [Fact]
    public void Mid_quarter_property_sold_at_the_end_of_its_last_year_keeps_no_book_value()
    {
        // IRS Publication 946 Table A-5 (placed in service in the fourth quarter), 3-year: 8.33, 61.11, 20.37, 10.19 %.
        // The proposal leaves the quarter of disposal out: the reader takes the fourth, when the recovery has ended.
        var model = new ModelSpec
        {
            Horizon = 4,
            PeriodsPerYear = 1,
            Rate = new RateSpec { Value = 0.10 },
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Tooling", Category = Capital, Period = 0, Amount = -10_000 },
                new ElementSpec { Type = ElementKind.Uniform, Label = "Saved", Category = Revenue, First = 1, Last = 4, Amount = 4_000 },
            ],
        };
        var tax = new TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.ThreeYear, Convention = MacrsConvention.MidQuarter, PlacedInPeriod = 4 },
        };
        var table = AfterTaxEvaluator.Evaluate(model, tax).Value!.Table;
        Assert.Equal(1_019, table.Rows[4].Depreciation, 0);
        Assert.Equal(0, table.BookValueAtDisposal, 6);
        Assert.Equal(0, table.GainOnDisposal, 6);
    }

    [Fact]
    public void A_disposal_in_the_last_year_before_the_recovery_ends_keeps_the_part_up_to_the_disposal()
    {
        // Nonresidential real property placed in service in December: its recovery ends in mid-December of year 40.
        // Sold in March of year 40 it is disposed of before the end of its recovery period, so IRS Publication 946's
        // mid-month rule gives 2.5 months of a full year's 2.564 % (Table A-7a, years 2-39): 0.534 %, not the table's
        // 2.461 % of year 40 (the rule applied to the table by hand).
        var schedule = Macrs.Schedule(100_000, MacrsClass.Nonresidential, MacrsConvention.MidMonth, 12);
        var sold = schedule.DisposedIn(40, Macrs.DisposalYearShare(MacrsConvention.MidMonth, 3));
        Assert.Equal(2.564 * 2.5 / 12, sold.Amounts[^1] / 1_000, 3);
        Assert.Equal(100_000.0 / 39 * (11.5 - 2.5) / 12, sold.BookValueAfter(40), 6);

        // The same with quarters: 3-year property placed in service in the fourth quarter, sold in the second quarter of
        // year 4 (before the recovery ends in mid-fourth-quarter): 4.5 of the 10.5 months left, of Table A-5's 10.19 %.
        var tooling = Macrs.Schedule(100_000, MacrsClass.ThreeYear, MacrsConvention.MidQuarter, 4);
        var early = tooling.DisposedIn(4, Macrs.DisposalYearShare(MacrsConvention.MidQuarter, 2));
        Assert.Equal(10.19 * 4.5 / 10.5, early.Amounts[^1] / 1_000, 2);
    }

    [Fact]
    public void Property_disposed_of_in_the_year_it_was_placed_in_service_is_not_depreciated()
    {
        // IRS Publication 946: no depreciation for property placed in service and disposed of in the same year (from
        // memory). A one-year study of 5-year property: nothing deducted, the whole basis is the book value at the sale,
        // so a resale of 80,000 is a loss of 20,000 (hand computation).
        var model = Models.Valid(1, 1, new SingleAmount("Jig", Capital, 0, -100_000), new SingleAmount("Resale", Salvage, 1, 80_000));
        var schedule = Macrs.Schedule(100_000, MacrsClass.FiveYear, MacrsConvention.HalfYear);
        var result = AfterTaxAnalysis.Compute(model, new TaxSettings(0.25, schedule, Macrs.DisposalYearShare(MacrsConvention.HalfYear, 0)));
        Assert.Equal(0, result.Rows[1].Depreciation, 9);
        Assert.Equal(100_000, result.BookValueAtDisposal, 9);
        Assert.Equal(-20_000, result.GainOnDisposal, 9);
        Assert.Equal(-0.25 * 20_000, result.Rows[1].Tax, 9);
        // The book methods keep their first year (common practice, no source): straight line over 5 years deducts 20,000.
        Assert.Equal(20_000, BookDepreciation.StraightLine(100_000, 0, 5).DisposedIn(1, 1).Amounts[0], 9);
    }
}
