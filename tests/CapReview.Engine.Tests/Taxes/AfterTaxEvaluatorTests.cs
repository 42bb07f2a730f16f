using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Taxes;

public class AfterTaxEvaluatorTests
{
    private static ModelSpec Press(int periodsPerYear = 1) => new()
    {
        Horizon = 5,
        PeriodsPerYear = periodsPerYear,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -100_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Labour saved", Category = CashFlowCategory.Revenue, First = 1, Last = 5, Amount = 30_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 5, Amount = 10_000 },
        ],
    };

    private static readonly TaxSpec StraightLine = new()
    {
        IncomeTaxRate = 0.25,
        Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 5, Salvage = 10_000 },
    };

    [Fact]
    public void The_after_tax_measures_rest_on_the_after_tax_flows_at_the_after_tax_MARR()
    {
        var outcome = AfterTaxEvaluator.Evaluate(Press(), StraightLine);
        Assert.True(outcome.IsValid, string.Join("; ", outcome.Errors.Select(e => e.Field + ": " + e.Message)));
        var result = outcome.Value!;
        // Hand computation (see AfterTaxAnalysisTests): −100,000, then 27,000 a year and 10,000 resale at year 5.
        double[] hand = [-100_000, 27_000, 27_000, 27_000, 27_000, 37_000];
        double irr = Financial.IRR(ref hand);
        Assert.Equal(irr, result.AfterTax.UniqueRateOfReturn!.Value, 9);
        // Default after-tax MARR: 10 % × (1 − 25 %) = 7.5 %; the worth from Financial.NPV at 7.5 %.
        Assert.Equal(0.075, result.AfterTax.Marr.EffectiveAnnual(), 12);
        double[] later = hand[1..];
        Assert.Equal(-100_000 + Financial.NPV(0.075, ref later), result.AfterTax.PresentWorth, 6);
        Assert.Equal(0.10, result.BeforeTax.Marr.EffectiveAnnual(), 12);
        Assert.Null(result.Equity);
    }

    [Fact]
    public void A_stated_after_tax_MARR_a_combined_rate_and_a_loan_are_read()
    {
        var tax = StraightLine with
        {
            IncomeTaxRate = 0.21,
            StateTaxRate = 0.06,
            AfterTaxMarr = new RateSpec { Value = 0.08 },
            Loan = new LoanSpec { Share = 0.5, Rate = 0.06, Term = 5 },
        };
        var result = AfterTaxEvaluator.Evaluate(Press(), tax).Value!;
        Assert.Equal(0.2574, result.Settings.IncomeTaxRate, 12);
        Assert.Equal(0.08, result.AfterTax.Marr.EffectiveAnnual(), 12);
        Assert.NotNull(result.Equity);
        Assert.Equal(-50_000, result.Table.Rows[0].Equity, 9);
    }

    [Fact]
    public void MACRS_is_read_with_its_convention_and_sold_at_the_horizon_before_the_end_of_recovery()
    {
        var tax = new TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.SevenYear },
        };
        var result = AfterTaxEvaluator.Evaluate(Press(), tax).Value!;
        // IRS Publication 946, Table A-1 (7-year, half-year): 14.29, 24.49, 17.49, 12.49, then half of 8.93 in the year of sale.
        Assert.Equal([14_285.71, 24_489.80, 17_492.71, 12_494.79, 4_462.43], result.Table.Rows.Skip(1).Select(r => Math.Round(r.Depreciation, 2)));
    }

    [Fact]
    public void Every_bad_tax_field_is_named()
    {
        static IEnumerable<string> Fields(ModelSpec model, TaxSpec tax) => AfterTaxEvaluator.Evaluate(model, tax).Errors.Select(e => e.Field);
        Assert.Contains("tax.incomeTaxRate", Fields(Press(), StraightLine with { IncomeTaxRate = null }));
        Assert.Contains("tax.incomeTaxRate", Fields(Press(), StraightLine with { IncomeTaxRate = 1.2 }));
        Assert.Contains("tax.depreciation.method", Fields(Press(), StraightLine with { Depreciation = null }));
        Assert.Contains("tax.depreciation.life", Fields(Press(), StraightLine with { Depreciation = new DepreciationSpec { Method = DepreciationMethod.SumOfYearsDigits } }));
        Assert.Contains("tax.depreciation.placedInPeriod", Fields(Press(), StraightLine with
        {
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.FiveYear, Convention = MacrsConvention.MidQuarter },
        }));
        // The half-year convention and the other methods read no quarter or month (IRS Publication 946, "Which Convention Applies?").
        Assert.Contains("tax.depreciation.placedInPeriod", Fields(Press(), StraightLine with
        {
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.FiveYear, PlacedInPeriod = 3 },
        }));
        Assert.Contains("tax.depreciation.disposalPeriod", Fields(Press(), StraightLine with
        {
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.FiveYear, Convention = MacrsConvention.HalfYear, DisposalPeriod = 2 },
        }));
        Assert.Contains("tax.depreciation.placedInPeriod", Fields(Press(), StraightLine with
        {
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 5, PlacedInPeriod = 1 },
        }));
        Assert.Empty(Fields(Press(), StraightLine with
        {
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = MacrsClass.Nonresidential, PlacedInPeriod = 7, DisposalPeriod = 3 },
        }));
        Assert.Contains("tax.loan.term", Fields(Press(), StraightLine with { Loan = new LoanSpec { Share = 0.5, Rate = 0.05 } }));
        Assert.Contains("tax.credits[0].year", Fields(Press(), StraightLine with { Credits = [new TaxCreditSpec { Year = 9, Amount = 1 }] }));
        Assert.Contains("tax.afterTaxMarr.value", Fields(Press(), StraightLine with { AfterTaxMarr = new RateSpec() }));
        Assert.Contains("periodsPerYear", Fields(Press(12), StraightLine));
    }
}
