using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Evaluation;

public class PeriodTableTests
{
    private static Engine.Evaluation.Evaluation Evaluate() => Evaluator.Evaluate(new ModelSpec
    {
        Horizon = 6,
        Rate = new RateSpec { Value = 0.08, Basis = RateBasis.Effective },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -50_000 },
            new ElementSpec { Type = ElementKind.Arithmetic, Label = "Scrap avoided", Category = CashFlowCategory.Revenue, First = 1, Last = 6, Amount = 9_000, Step = 500 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Upkeep", Category = CashFlowCategory.Operating, First = 1, Last = 6, Amount = -1_200 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 6, Amount = 4_000 },
        ],
    }).Value!;

    [Fact]
    public void Each_period_sums_its_categories_and_discounts_with_the_single_payment_factor_of_VisualBasic_Financial()
    {
        var table = PeriodTable.Of(Evaluate());
        Assert.Equal(7, table.Count);
        // Period 3 by hand: revenue 9,000 + 2 × 500, operating −1,200 (common practice, no source).
        PeriodRow third = table[3];
        Assert.Equal(10_000, third.ByCategory[CashFlowCategory.Revenue]);
        Assert.Equal(-1_200, third.ByCategory[CashFlowCategory.Operating]);
        Assert.Equal(8_800, third.Net);
        // (P/F, 8 %, 3) as the present value of 1 due in three periods: Microsoft.VisualBasic.Financial.PV.
        Close.Assert(-Financial.PV(0.08, 3, 0, 1), third.Factor, 1e-14);
        Close.Assert(8_800 * -Financial.PV(0.08, 3, 0, 1), third.PresentWorth, 1e-12);
    }

    [Fact]
    public void The_cumulative_present_worth_ends_at_the_models_present_worth_from_VisualBasic_Financial_NPV()
    {
        var evaluation = Evaluate();
        var table = PeriodTable.Of(evaluation);
        double[] later = [.. table.Skip(1).Select(r => r.Net)];
        double npv = table[0].Net + Financial.NPV(0.08, ref later);
        Close.Assert(npv, table[^1].CumulativePresentWorth, 1e-12);
        // Each element's worth, added up, is the model's (common practice, no source).
        Close.Assert(npv, PeriodTable.ElementWorths(evaluation).Sum(), 1e-12);
        Close.Assert(-50_000, PeriodTable.ElementWorths(evaluation)[0], 1e-15);
    }
}
