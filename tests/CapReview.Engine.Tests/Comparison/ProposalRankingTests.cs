using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

public class ProposalRankingTests
{
    private static readonly AnnualRate TenPercent = AnnualRate.Effective(0.10);

    // A short life with a high yearly saving, a long one with a lower saving: by present worth over their own lives
    // the long one looks better, by annual worth the short one is.
    private static readonly CashFlowModel Short = Models.Valid(3, 1,
        new SingleAmount("Unit", Capital, 0, -10_000),
        new UniformSeries("Saving", Revenue, 1, 3, 5_000));

    private static readonly CashFlowModel Long = Models.Valid(6, 1,
        new SingleAmount("Unit", Capital, 0, -16_000),
        new UniformSeries("Saving", Revenue, 1, 6, 4_500));

    [Fact]
    public void Unequal_lives_rank_by_annual_worth_not_by_present_worth_over_each_life()
    {
        var ranked = ProposalRanking.Rank([new("Long", Long, TenPercent), new("Short", Short, TenPercent)]);
        // Outside reference: Microsoft.VisualBasic.Financial.PV and Pmt give each life's PW and its annual equivalent.
        double pwShort = -10_000 - Financial.PV(0.10, 3, 5_000), pwLong = -16_000 - Financial.PV(0.10, 6, 4_500);
        double awShort = Financial.Pmt(0.10, 3, -pwShort), awLong = Financial.Pmt(0.10, 6, -pwLong);
        Assert.True(pwLong > pwShort && awShort > awLong);
        Assert.Equal(["Short", "Long"], ranked.Select(r => r.Id));
        Assert.Equal([1, 2], ranked.Select(r => r.Rank));
        Close.Assert(awShort, ranked[0].AnnualWorth, 1e-12);
        Close.Assert(pwLong, ranked[1].PresentWorth, 1e-12);
        Assert.Equal(ProposalRanking.Repeatability, ranked[0].Basis);
        Assert.Equal(10_000, ranked[0].FirstCost);
        Assert.Equal(3, ranked[0].LifeYears);
    }

    [Fact]
    public void Annual_worth_ranking_matches_present_worth_over_the_common_multiple_of_the_lives()
    {
        // Common practice, no source: under repeatability, AW order equals PW order over the LCM of the lives (6 years).
        // Outside reference for the renewal: Microsoft.VisualBasic.Financial.PV gives (P/F, 10%, 3).
        double renewal = Financial.PV(0.10, 3, 0, -1);
        double pwShortOverSix = Short.ClosedFormPresentWorth(0.10) * (1 + renewal);
        double pwLongOverSix = Long.ClosedFormPresentWorth(0.10);
        var ranked = ProposalRanking.Rank([new("Long", Long, TenPercent), new("Short", Short, TenPercent)], studyPeriodYears: 6);
        Close.Assert(pwShortOverSix, ranked.Single(r => r.Id == "Short").PresentWorth, 1e-12);
        Close.Assert(pwLongOverSix, ranked.Single(r => r.Id == "Long").PresentWorth, 1e-12);
        Assert.Equal(["Short", "Long"], ranked.Select(r => r.Id));
        Assert.Contains("2 lives of 3 periods", ranked[0].Basis);
    }

    [Fact]
    public void A_study_period_shorter_than_the_life_uses_the_stated_market_value_or_says_it_took_zero()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.PV for four years of savings and the value at year 4, Pmt to spread it.
        var ranked = ProposalRanking.Rank([new("Long", Long, TenPercent, ValueAtStudyEnd: 6_000), new("Short", Short, TenPercent)], studyPeriodYears: 4);
        var longRow = ranked.Single(r => r.Id == "Long");
        double expected = -16_000 - Financial.PV(0.10, 4, 4_500) - Financial.PV(0.10, 4, 0, 6_000);
        Close.Assert(expected, longRow.PresentWorth, 1e-12);
        Close.Assert(Financial.Pmt(0.10, 4, -expected), longRow.AnnualWorth, 1e-12);
        Assert.StartsWith("study period of 4 years: cut at period 4", longRow.Basis);
        Assert.EndsWith("no value stated, taken as zero", ranked.Single(r => r.Id == "Short").Basis);
    }

    [Fact]
    public void A_marr_shift_ranks_at_the_shifted_rate()
    {
        var ranked = ProposalRanking.Rank([new("Long", Long, TenPercent), new("Short", Short, TenPercent)], marrShift: 0.02);
        Close.Assert(MarrWhatIf.AnnualWorthAt(Short, 0.12), ranked.Single(r => r.Id == "Short").AnnualWorth, 1e-12);
        Close.Assert(0.12, ranked[0].Evaluation.Marr.EffectiveAnnual(), 1e-15);
    }

    [Fact]
    public void Capital_after_period_zero_is_counted_in_its_budget_year()
    {
        // Monthly periods: months 1 to 12 are budget year 1, month 13 starts year 2. Operating costs do not count.
        var phased = Models.Valid(36, 12,
            new SingleAmount("Phase 1", Capital, 0, -50_000),
            new SingleAmount("Phase 2", Capital, 12, -20_000),
            new SingleAmount("Phase 3", Capital, 13, -5_000),
            new UniformSeries("Upkeep", Operating, 1, 36, -100),
            new UniformSeries("Output", Revenue, 1, 36, 3_000));
        Assert.Equal([20_000, 5_000, 0], ProposalRanking.LaterCapital(phased));
        var ranked = ProposalRanking.Rank([new("Phased", phased, TenPercent)]);
        Assert.Equal(50_000, ranked[0].FirstCost);
        Assert.Equal([20_000, 5_000, 0], ranked[0].LaterCapital);
    }

    [Fact]
    public void Ties_keep_a_stable_order_by_reference() =>
        Assert.Equal(["A", "B"], ProposalRanking.Rank([new("B", Short, TenPercent), new("A", Short, TenPercent)]).Select(r => r.Id));
}
