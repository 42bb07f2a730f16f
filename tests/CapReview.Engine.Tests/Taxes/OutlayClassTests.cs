using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Taxes;

/// <summary>A later capital outlay depreciated by a class or life of its own rather than the first cost's.</summary>
public class OutlayClassTests
{
    // An invented plant: 100,000 of equipment now, an addition at year 3, 30,000 saved a year, resold at the horizon.
    private static ModelSpec Plant(int horizon, int additionPeriod, double addition, double resale, OutlayClass? depreciatedAs, bool? expensed = null) => new()
    {
        Horizon = horizon,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Equipment", Category = CashFlowCategory.Capital, Period = 0, Amount = -100_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Labour saved", Category = CashFlowCategory.Revenue, First = 1, Last = horizon, Amount = 30_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Addition", Category = CashFlowCategory.Capital, Period = additionPeriod, Amount = -addition, Expensed = expensed, DepreciatedAs = depreciatedAs },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = horizon, Amount = resale },
        ],
    };

    private static readonly TaxSpec SevenYearMacrs = new()
    {
        IncomeTaxRate = 0.25,
        Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.SevenYear },
    };

    private static IEnumerable<string> Fields(ModelSpec model, TaxSpec tax) => AfterTaxEvaluator.Evaluate(model, tax).Errors.Select(e => e.Field + ": " + e.Message);

    [Fact]
    public void An_addition_of_nonresidential_real_property_under_a_seven_year_first_cost_is_depreciated_over_39_years_mid_month()
    {
        var result = OutlayCases.Evaluate(Plant(10, 3, 100_000, 60_000, new OutlayClass { PropertyClass = MacrsClass.Nonresidential }), SevenYearMacrs);
        // IRS Publication 946, Table A-1 (7-year property, half-year convention): 14.29, 24.49, 17.49, 12.49, 8.93,
        // 8.92, 8.93, 4.46 % of the equipment's 100,000 in years 1 to 8.
        // Table A-7a (39-year nonresidential real property, mid-month), the addition placed in service in January of
        // year 3 (the stated default when the first cost is not real property): 2.461 % in its first year, 2.564 % in
        // years 2 to 39; sold in December of year 10, before the end of its recovery period, it takes 11.5 of 12
        // months of 2.564 % ("Early dispositions", mid-month convention).
        double[] hand =
        [
            0, 14_290, 24_490, 17_490 + 2_461, 12_490 + 2_564, 8_930 + 2_564, 8_920 + 2_564, 8_930 + 2_564, 4_460 + 2_564, 2_564,
            2_564 * 11.5 / 12,
        ];
        // The tables round each percentage (A-1 to 0.01 %, A-7a to 0.001 %, and A-7a's January column puts its residue
        // in year 1: 2.461 % against the rule's 11.5/12 of 1/39, 2.457 %): at most 5 + 4 on these bases.
        for (int t = 0; t <= 10; t++)
        {
            Assert.True(Math.Abs(hand[t] - result.Table.Rows[t].Depreciation) <= 9, $"year {t}: {result.Table.Rows[t].Depreciation} against {hand[t]}");
        }
        // Book value at year 10: the equipment 0; the addition 100,000 − (2,461 + 6 × 2,564 + 2,457.17) = 79,697.83.
        Assert.Equal(79_697.83, result.Table.BookValueAtDisposal, 9.0);
        Assert.Equal(60_000 - 79_697.83, result.Table.GainOnDisposal, 9.0);
    }

    [Fact]
    public void Under_straight_line_an_outlay_with_its_own_life_is_depreciated_over_it_to_no_salvage()
    {
        var result = OutlayCases.Evaluate(Plant(5, 2, 20_000, 10_000, new OutlayClass { Life = 10 }), OutlayCases.StraightLine);
        // Hand computation (straight line, common practice, no source): the equipment (100,000 − 10,000) / 5 = 18,000
        // a year; the addition 20,000 / 10 = 2,000 a year from year 2, four years held: book value 12,000 at year 5.
        double[] hand = [0, 18_000, 20_000, 20_000, 20_000, 20_000];
        Assert.Equal(hand, result.Table.Rows.Select(r => Math.Round(r.Depreciation, 6)));
        Assert.Equal(10_000 + 12_000, result.Table.BookValueAtDisposal, 6);
        Assert.Equal(10_000 - 22_000, result.Table.GainOnDisposal, 6);
    }

    [Fact]
    public void With_no_class_of_its_own_an_outlay_takes_the_first_costs_as_before()
    {
        var own = OutlayCases.Evaluate(Plant(10, 3, 100_000, 60_000, new OutlayClass { PropertyClass = MacrsClass.SevenYear }), SevenYearMacrs);
        var first = OutlayCases.Evaluate(Plant(10, 3, 100_000, 60_000, null), SevenYearMacrs);
        Assert.Equal(first.Table.Rows.Select(r => r.Depreciation), own.Table.Rows.Select(r => r.Depreciation));
        // An empty choice is no choice: nothing is stored for it.
        Assert.Null(new ElementSpec { DepreciatedAs = new OutlayClass() }.DepreciatedAs);
    }

    [Fact]
    public void A_life_out_of_range_is_named_at_the_elements_field()
    {
        Assert.Equal(["elements[2].depreciatedAs: Give a life of 1 to 100 years."], Fields(Plant(5, 2, 20_000, 0, new OutlayClass { Life = 0 }), OutlayCases.StraightLine));
        Assert.Equal(["elements[2].depreciatedAs: Give a life of 1 to 100 years."], Fields(Plant(5, 2, 20_000, 0, new OutlayClass { Life = 101 }), OutlayCases.StraightLine));
    }

    [Fact]
    public void A_class_or_life_that_does_not_fit_the_first_costs_method_is_refused()
    {
        Assert.Equal(["elements[2].depreciatedAs: The first cost is depreciated over a life: give a life of 1 to 100 years."],
            Fields(Plant(5, 2, 20_000, 0, new OutlayClass { PropertyClass = MacrsClass.FiveYear }), OutlayCases.StraightLine));
        Assert.Equal(["elements[2].depreciatedAs: The first cost is depreciated by MACRS: choose a MACRS property class."],
            Fields(Plant(5, 2, 20_000, 0, new OutlayClass { Life = 10 }), SevenYearMacrs));
        var decliningBalance = new TaxSpec { IncomeTaxRate = 0.25, Depreciation = new DepreciationSpec { Method = DepreciationMethod.DecliningBalance, Life = 8, Factor = 2 } };
        Assert.Equal(["elements[2].depreciatedAs: The declining-balance factor is more than this life: give a life of at least the factor."],
            Fields(Plant(5, 2, 20_000, 0, new OutlayClass { Life = 1 }), decliningBalance));
    }

    [Fact]
    public void Only_a_capital_cost_after_period_0_not_a_repair_can_have_a_class_of_its_own()
    {
        var own = new OutlayClass { Life = 10 };
        var plant = Plant(5, 2, 20_000, 0, null);
        var onRevenue = plant with { Elements = [.. plant.Elements!.Select((e, k) => k == 1 ? e! with { DepreciatedAs = own } : e)] };
        var onFirstCost = plant with { Elements = [.. plant.Elements!.Select((e, k) => k == 0 ? e! with { DepreciatedAs = own } : e)] };
        Assert.Equal(["elements[1].depreciatedAs: Only a capital cost after period 0 can be depreciated by a class or life of its own."], Fields(onRevenue, OutlayCases.StraightLine));
        Assert.Equal(["elements[0].depreciatedAs: Only a capital cost after period 0 can be depreciated by a class or life of its own."], Fields(onFirstCost, OutlayCases.StraightLine));
        Assert.Equal(["elements[2].depreciatedAs: A repair is deducted in its year: untick the repair to depreciate it by a class or life of its own."],
            Fields(Plant(5, 2, 20_000, 0, own, expensed: true), OutlayCases.StraightLine));
        Assert.Equal(["elements[2].depreciatedAs: Give either a MACRS property class or a life, not both."],
            Fields(Plant(5, 2, 20_000, 0, new OutlayClass { Life = 10, PropertyClass = MacrsClass.FiveYear }), OutlayCases.StraightLine));
    }
}
