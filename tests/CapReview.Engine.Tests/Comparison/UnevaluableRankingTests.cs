using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

/// <summary>One proposal the ranking cannot evaluate is set aside with its reason; the others are ranked as ever.</summary>
public class UnevaluableRankingTests
{
    private static readonly CashFlowModel Pump = Models.Valid(5, 1,
        new SingleAmount("Pump", Capital, 0, -10_000),
        new UniformSeries("Saving", Revenue, 1, 5, 3_000));

    // 1,200 years of a receipt: at −45% a year (the −40% bound shifted by −5 points) its worth is 1.8^1200 ≈ 10^306
    // times each receipt, past every double with receipts of 10^12.
    private static readonly CashFlowModel Forever = Models.Valid(1200, 1,
        new SingleAmount("Dam", Capital, 0, -1e12),
        new UniformSeries("Water sold", Revenue, 1, 1200, 1e12));

    [Fact]
    public void A_shift_that_takes_one_worth_past_every_double_leaves_the_others_ranked()
    {
        var outcome = ProposalRanking.RankEvaluable(
            [new("Pump", Pump, AnnualRate.Effective(0.10)), new("Dam", Forever, AnnualRate.Effective(MarrBounds.LowestEffectiveAnnual))], marrShift: -0.05);
        var pump = Assert.Single(outcome.Ranked);
        Assert.Equal("Pump", pump.Id);
        Assert.Equal(1, pump.Rank);
        // Outside reference: Microsoft.VisualBasic.Financial.PV and Pmt at the shifted 5%.
        Close.Assert(Financial.Pmt(0.05, 5, 10_000 + Financial.PV(0.05, 5, 3_000)), pump.AnnualWorth, 1e-12);
        var dam = Assert.Single(outcome.Unevaluable);
        Assert.Equal("Dam", dam.Id);
        Assert.Contains("beyond the largest number", dam.Reason, StringComparison.Ordinal);
        Assert.Throws<ArgumentException>(() => ProposalRanking.Rank([new("Pump", Pump, AnnualRate.Effective(0.10)), new("Dam", Forever, AnnualRate.Effective(-0.4))], marrShift: -0.05));
    }

    [Fact]
    public void A_shift_past_minus_100_percent_is_named_not_thrown()
    {
        var outcome = ProposalRanking.RankEvaluable([new("Pump", Pump, AnnualRate.Effective(-0.6)), new("Other", Pump, AnnualRate.Effective(0.1))], marrShift: -0.5);
        Assert.Equal("Other", Assert.Single(outcome.Ranked).Id);
        Assert.Contains("outside −100% … 1000%", Assert.Single(outcome.Unevaluable).Reason, StringComparison.Ordinal);
    }
}
