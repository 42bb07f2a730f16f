using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Taxes;

/// <summary>A capital outlay after the first cost (an overhaul) is an asset of its own, unless it is a repair.</summary>
public class LaterOutlayTests
{
    // An invented press: 100,000 now, an overhaul at year 3, 30,000 saved a year, resold at the horizon.
    private static ModelSpec Press(int horizon, int overhaulPeriod, double overhaul, double resale, bool? expensed = null) => new()
    {
        Horizon = horizon,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -100_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Labour saved", Category = CashFlowCategory.Revenue, First = 1, Last = horizon, Amount = 30_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Overhaul", Category = CashFlowCategory.Capital, Period = overhaulPeriod, Amount = -overhaul, Expensed = expensed },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = horizon, Amount = resale },
        ],
    };

    private static readonly TaxSpec FiveYearMacrs = new()
    {
        IncomeTaxRate = 0.25,
        Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.FiveYear },
    };

    [Fact]
    public void An_overhaul_is_MACRS_property_placed_in_service_in_its_year_and_its_book_value_meets_the_resale()
    {
        var result = OutlayCases.Evaluate(Press(7, 3, 40_000, 10_000), FiveYearMacrs);
        // IRS Publication 946, Table A-1 (5-year property, half-year convention): 20.00, 32.00, 19.20, 11.52, 11.52, 5.76 %.
        // The press from year 1: 20,000, 32,000, 19,200, 11,520, 11,520, 5,760 (years 1 to 6).
        // The overhaul of 40,000 from year 3: 8,000, 12,800, 7,680, 4,608, then in year 7, its fifth tax year and
        // before the end of its recovery period, half of 4,608 ("Early dispositions", half-year convention): 2,304.
        double[] hand = [0, 20_000, 32_000, 19_200 + 8_000, 11_520 + 12_800, 11_520 + 7_680, 5_760 + 4_608, 2_304];
        Assert.Equal(hand, result.Table.Rows.Select(r => Math.Round(r.Depreciation, 6)));
        // Book value at year 7: the press 0; the overhaul 40,000 − (8,000 + 12,800 + 7,680 + 4,608 + 2,304) = 4,608.
        Assert.Equal(4_608, result.Table.BookValueAtDisposal, 6);
        Assert.Equal(10_000 - 4_608, result.Table.GainOnDisposal, 6);
        // Year 3: the overhaul is paid but not deducted; tax 25 % × (30,000 − 27,200) = 700.
        Assert.Equal(700, result.Table.Rows[3].Tax, 6);
        Assert.Equal(30_000 - 40_000 - 700, result.Table.Rows[3].AfterTax, 6);
    }

    [Fact]
    public void An_outlay_marked_as_a_repair_is_deducted_in_its_year()
    {
        var result = OutlayCases.Evaluate(Press(7, 3, 40_000, 10_000, expensed: true), FiveYearMacrs);
        // Publication 946, Table A-1 for the press alone; the repair of 40,000 deducted in year 3.
        double[] hand = [0, 20_000, 32_000, 19_200, 11_520, 11_520, 5_760, 0];
        Assert.Equal(hand, result.Table.Rows.Select(r => Math.Round(r.Depreciation, 6)));
        Assert.Equal(0.25 * (30_000 - 40_000 - 19_200), result.Table.Rows[3].Tax, 6);
        Assert.Equal(0, result.Table.BookValueAtDisposal, 6);
        Assert.Equal(10_000, result.Table.GainOnDisposal, 6);
    }

    [Fact]
    public void Under_a_book_method_an_outlay_is_depreciated_over_the_same_life_to_no_salvage()
    {
        var result = OutlayCases.Evaluate(Press(5, 2, 20_000, 10_000), OutlayCases.StraightLine);
        // Hand computation (straight line, common practice, no source): the press (100,000 − 10,000) / 5 = 18,000 a
        // year; the outlay 20,000 / 5 = 4,000 a year from year 2, four years held: book value 4,000 at year 5.
        double[] hand = [0, 18_000, 22_000, 22_000, 22_000, 22_000];
        Assert.Equal(hand, result.Table.Rows.Select(r => Math.Round(r.Depreciation, 6)));
        Assert.Equal(10_000 + 4_000, result.Table.BookValueAtDisposal, 6);
        Assert.Equal(-4_000, result.Table.GainOnDisposal, 6);
    }

    [Fact]
    public void The_depreciation_taken_on_an_outlay_is_recaptured_with_the_first_costs_and_only_the_excess_over_both_bases_is_at_the_gain_rate()
    {
        var result = OutlayCases.Evaluate(Press(5, 2, 20_000, 125_000), OutlayCases.StraightLine with { GainTaxRate = 0.15 });
        // Hand computation (IRC §1245 recapture as IRS Publication 544 summarises it, from memory): bases 100,000 +
        // 20,000; depreciation taken 5 × 18,000 + 4 × 4,000 = 106,000; book value 14,000; gain 111,000, of which
        // 106,000 recaptured as ordinary income and 125,000 − 120,000 = 5,000 at the gain rate.
        Assert.Equal(111_000, result.Table.GainOnDisposal, 6);
        Assert.Equal(0.25 * (30_000 - 22_000 + 106_000) + 0.15 * 5_000, result.Table.Rows[5].Tax, 6);
    }

    [Fact]
    public void An_outlay_in_the_year_of_disposal_takes_no_depreciation_and_its_cost_is_book_value()
    {
        var result = OutlayCases.Evaluate(Press(5, 5, 6_000, 10_000), OutlayCases.StraightLine);
        // Property placed in service and disposed of in the same year takes no depreciation (IRS Publication 946, from memory).
        Assert.Equal(18_000, result.Table.Rows[5].Depreciation, 6);
        Assert.Equal(10_000 + 6_000, result.Table.BookValueAtDisposal, 6);
        Assert.Equal(-6_000, result.Table.GainOnDisposal, 6);
    }

    [Fact]
    public void A_recurring_overhaul_is_one_asset_for_each_occurrence()
    {
        var model = Press(6, 1, 0, 0) with
        {
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -100_000 },
                new ElementSpec { Type = ElementKind.Recurring, Label = "Relining", Category = CashFlowCategory.Capital, First = 2, Last = 4, Every = 2, Amount = -9_000 },
            ],
        };
        var tax = FiveYearMacrs with { Depreciation = FiveYearMacrs.Depreciation! with { PropertyClass = MacrsClass.ThreeYear } };
        var result = OutlayCases.Evaluate(model, tax);
        // IRS Publication 946, Table A-1 (3-year property, half-year convention): 33.33, 44.45, 14.81, 7.41 %, the
        // table's rounding of 1/3, 4/9, 4/27 and 2/27 (200 % declining balance, half a year first, then straight line).
        // The relining of year 2: 9,000 × those shares = 3,000, 4,000, 1,333.33, 666.67 in years 2 to 5; the one of
        // year 4: 3,000, 4,000, then in year 6, its third year and before the end of its recovery, half of 1,333.33.
        double[] relining = [0, 0, 3_000, 4_000, 1_333.33 + 3_000, 666.67 + 4_000, 666.67];
        double[] press = [.. result.Table.Rows.Select(r => r.Depreciation).Zip(relining, (all, r) => all - r)];
        Assert.Equal([0, 33_333.33, 44_444.44, 14_814.81, 7_407.41, 0, 0], press.Select(p => Math.Round(p, 2)));
        // Book value at year 6: the press and the first relining 0; the second 9,000 − 3,000 − 4,000 − 666.67.
        Assert.Equal(1_333.33, result.Table.BookValueAtDisposal, 2);
    }

    [Fact]
    public void Only_a_capital_cost_after_period_0_can_be_a_repair()
    {
        var revenue = Press(7, 3, 40_000, 10_000) with { Elements = [.. Press(7, 3, 40_000, 10_000).Elements!.Select((e, k) => k == 1 ? e! with { Expensed = true } : e)] };
        var firstCost = Press(7, 3, 40_000, 10_000) with { Elements = [.. Press(7, 3, 40_000, 10_000).Elements!.Select((e, k) => k == 0 ? e! with { Expensed = true } : e)] };
        Assert.Equal(["elements[1].expensed"], SpecificationReader.Read(revenue).Errors.Select(e => e.Field));
        Assert.Equal(["elements[0].expensed"], SpecificationReader.Read(firstCost).Errors.Select(e => e.Field));
        // Unticked is the same as never set: nothing stored changes for a proposal without the flag.
        Assert.Null(new ElementSpec { Expensed = false }.Expensed);
        Assert.True(new ElementSpec { Expensed = true }.Expensed);
    }
}
