using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using CsCheck;
using Microsoft.VisualBasic;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

public class StudyPeriodWorthTests
{
    private static readonly CashFlowModel Pump = Models.Valid(6, 1,
        new SingleAmount("Pump", Capital, 0, -30_000),
        new UniformSeries("Energy saved", Revenue, 1, 6, 8_000),
        new SingleAmount("Resale", Salvage, 6, 3_000));

    [Fact]
    public void Over_its_own_life_the_study_worth_is_the_present_worth()
    {
        var result = StudyPeriodWorth.Compute(Pump, 0.08, 6, valueAtEnd: 123);
        Close.Assert(Pump.ClosedFormPresentWorth(0.08), result.PresentWorth, 1e-12);
        Assert.Equal("the life itself", result.Basis);
    }

    [Fact]
    public void A_shorter_study_period_cuts_the_flows_and_takes_the_market_value()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.PV for the four savings and the value at year 4.
        var result = StudyPeriodWorth.Compute(Pump, 0.08, 4, valueAtEnd: 12_000);
        double expected = -30_000 - Financial.PV(0.08, 4, 8_000) - Financial.PV(0.08, 4, 0, 12_000);
        Close.Assert(expected, result.PresentWorth, 1e-12);
        Close.Assert(expected * Financial.Pmt(0.08, 4, -1), result.PeriodWorth, 1e-12);
        Assert.Contains("cut at period 4", result.Basis);
    }

    [Fact]
    public void A_longer_study_period_renews_the_life_and_values_the_renewal_at_its_end()
    {
        // Renewed at year 6 (resale 3,000 in, a new pump 30,000 out), cut at year 9 with the renewal worth 18,000.
        var result = StudyPeriodWorth.Compute(Pump, 0.08, 9, valueAtEnd: 18_000);
        double[] flows = [-30_000, 8_000, 8_000, 8_000, 8_000, 8_000, 8_000 + 3_000 - 30_000, 8_000, 8_000, 8_000 + 18_000];
        double[] later = flows.Skip(1).ToArray();
        Close.Assert(flows[0] + Financial.NPV(0.08, ref later), result.PresentWorth, 1e-12);
        Assert.Contains("renewed", result.Basis);
    }

    [Fact]
    public void Whole_lives_need_no_stated_value()
    {
        var twice = StudyPeriodWorth.Compute(Pump, 0.08, 12, valueAtEnd: 99_999);
        double one = Pump.ClosedFormPresentWorth(0.08);
        Close.Assert(one + one * Math.Pow(1.08, -6), twice.PresentWorth, 1e-12);
    }
}

public class StudyPeriodLimitTests
{
    [Fact]
    public void A_study_period_of_1200_periods_is_covered_even_when_the_last_renewal_runs_past_it()
    {
        // Monthly, a 7-month life and the longest study period: the 172nd renewal ends at month 1,204.
        var model = Models.Valid(7, 12, new SingleAmount("Tooling", Capital, 0, -700), new UniformSeries("Output", Revenue, 1, 7, 110));
        var result = StudyPeriodWorth.Compute(model, 0.01, 1200, valueAtEnd: 300);
        // Outside reference: Microsoft.VisualBasic.Financial.PV: 1,200 months of output, a new set of tooling every
        // 7 months up to month 1,197, and the last one's value at month 1,200.
        double tooling = Enumerable.Range(0, 172).Sum(j => -700 * Math.Pow(1.01, -7 * j));
        double expected = tooling - Financial.PV(0.01, 1200, 110) - Financial.PV(0.01, 1200, 0, 300);
        Close.Assert(expected, result.PresentWorth, 1e-9);
    }
}

public class EconomicServiceLifeTests
{
    // An invented forklift: 40,000 new, losing value, costing more to run each year.
    private static readonly double[] Values = [30_000, 23_000, 17_500, 13_000, 9_500, 7_000, 5_000];
    private static readonly double[] Operating = [4_000, 5_000, 6_500, 8_500, 11_000, 14_000, 17_500];

    [Fact]
    public void The_annual_cost_of_each_retirement_year_matches_the_factor_formula()
    {
        // Outside reference: Microsoft.VisualBasic.Financial.Pmt for (A/P) and (A/F), NPV for the operating costs.
        var life = EconomicServiceLife.Of(40_000, Values, Operating, 0.10);
        for (int k = 1; k <= Values.Length; k++)
        {
            double[] operating = Operating.Take(k).ToArray();
            double expected = Financial.Pmt(0.10, k, -40_000) + Financial.Pmt(0.10, k, 0, Values[k - 1])
                + Financial.Pmt(0.10, k, -Financial.NPV(0.10, ref operating));
            Close.Assert(expected, life.AnnualCosts[k - 1], 1e-10, $"EAC({k})");
        }
        Assert.Equal(Array.IndexOf(life.AnnualCosts.ToArray(), life.AnnualCosts.Min()) + 1, life.BestYears);
        Assert.Equal(40_000 * 1.10 - 30_000 + 4_000, life.MarginalCosts[0], 9);
    }

    [Fact]
    public void The_annual_cost_is_the_equivalent_of_the_marginal_costs() =>
        // Common practice, no source: Σ MC_j (P/F, i, j) (A/P, i, k) = EAC(k).
        Gen.Select(Gen.Double[0.0, 0.25], Gen.Int[1, 15]).Sample((i, years) =>
        {
            double[] values = Enumerable.Range(1, years).Select(k => 50_000 * Math.Pow(0.8, k)).ToArray();
            double[] operating = Enumerable.Range(1, years).Select(k => 2_000.0 + 900 * k).ToArray();
            var life = EconomicServiceLife.Of(50_000, values, operating, i);
            for (int k = 1; k <= years; k++)
            {
                double pw = 0;
                for (int j = 1; j <= k; j++)
                {
                    pw += life.MarginalCosts[j - 1] / Math.Pow(1 + i, j);
                }
                double eac = pw * Engine.Factors.CompoundInterest.CapitalRecovery(i, k);
                if (Math.Abs(eac - life.AnnualCosts[k - 1]) > 1e-8 * Math.Abs(eac))
                {
                    return false;
                }
            }
            return true;
        });

    [Fact]
    public void The_defender_is_kept_while_its_next_year_costs_less_than_the_challengers_best_year()
    {
        var challenger = EconomicServiceLife.Of(40_000, Values, Operating, 0.10);
        // An old truck worth 8,000 today, 6,000 and 4,500 later, costing 9,000 then 12,000 then 16,000 to run.
        var defender = EconomicServiceLife.Of(8_000, [6_000, 4_500, 3_500], [9_000, 12_000, 16_000], 0.10);
        int keep = EconomicServiceLife.YearsToKeep(defender, challenger);
        Assert.Equal(defender.MarginalCosts.TakeWhile(c => c < challenger.LeastAnnualCost).Count(), keep);
        Assert.Equal(8_000 * 1.1 - 6_000 + 9_000, defender.MarginalCosts[0], 9);
        var worn = EconomicServiceLife.Of(8_000, [2_000], [30_000], 0.10);
        Assert.Equal(0, EconomicServiceLife.YearsToKeep(worn, challenger));
    }
}

public class ReplacementStudyTests
{
    // The invented forklift of the service-life tests as the challenger.
    private static readonly ServiceYear[] New =
        [new(30_000, 4_000), new(23_000, 5_000), new(17_500, 6_500), new(13_000, 8_500), new(9_500, 11_000), new(7_000, 14_000), new(5_000, 17_500)];

    [Fact]
    public void A_defender_whose_years_grow_dear_is_kept_until_its_next_year_costs_more_than_the_challengers_best()
    {
        // Marginal costs (common practice, no source): 8,000·1.1 − 6,000 + 5,000 = 7,800; 6,000·1.1 − 4,500 + 9,000 = 11,100;
        // 4,500·1.1 − 3,500 + 16,000 = 17,450. The challenger's least EAC (about 15,641) lies between the second and the third.
        var advice = ReplacementStudy.Advise(8_000, [new(6_000, 5_000), new(4_500, 9_000), new(3_500, 16_000)], 40_000, New, 0.10);
        Assert.Equal([7_800, 11_100, 17_450], advice.Defender.MarginalCosts.Select(c => Math.Round(c, 6)));
        Assert.InRange(advice.Challenger.LeastAnnualCost, 11_100, 17_450);
        Assert.Equal(2, advice.YearsToKeep);
        Assert.Equal(7_800, advice.NextYearCost, 9);
        Assert.Equal("Keep for 2 more years, then replace.", advice.Recommendation);
    }

    [Fact]
    public void A_worn_defender_is_replaced_now_and_a_cheap_one_is_kept_to_the_end_of_its_estimates()
    {
        Assert.StartsWith("Replace now", ReplacementStudy.Advise(8_000, [new(2_000, 30_000)], 40_000, New, 0.10).Recommendation);
        var cheap = ReplacementStudy.Advise(8_000, [new(7_500, 1_000), new(7_000, 1_000)], 40_000, New, 0.10);
        Assert.Equal(2, cheap.YearsToKeep);
        Assert.StartsWith("Keep for at least 2 more years", cheap.Recommendation);
    }
}

public class StudyPeriodAtALifeTests
{
    private static readonly AnnualRate EightPercent = AnnualRate.Effective(0.08);

    private static readonly CashFlowModel Pump = Models.Valid(6, 1,
        new SingleAmount("Pump", Capital, 0, -30_000),
        new UniformSeries("Energy saved", Revenue, 1, 6, 8_000),
        new SingleAmount("Resale", Salvage, 6, 3_000));

    [Theory]
    [InlineData(6)]
    [InlineData(12)]
    public void A_study_period_ending_exactly_at_a_life_takes_the_lives_own_resale_and_ranks_as_repeatability(int years)
    {
        // Hand-computed from the 8 % table of an engineering-economy handbook (from memory; A/P and A/F five decimals):
        // AW = −30,000 (A/P, 8%, 6) + 8,000 + 3,000 (A/F, 8%, 6) = −30,000 × 0.21632 + 8,000 + 3,000 × 0.13632 = 1,919.36.
        // Whole lives end at T with their own resale: a stated value is not added, and none missing is noted.
        double expected = -30_000 * 0.21632 + 8_000 + 3_000 * 0.13632;
        var stated = ProposalRanking.Rank([new("Pump", Pump, EightPercent, ValueAtStudyEnd: 50_000)], studyPeriodYears: years).Single();
        var unstated = ProposalRanking.Rank([new("Pump", Pump, EightPercent)], studyPeriodYears: years).Single();
        Assert.Equal(expected, stated.AnnualWorth, 0.5);
        Assert.Equal(stated.AnnualWorth, unstated.AnnualWorth, 1e-9);
        Assert.Equal(ProposalRanking.Rank([new("Pump", Pump, EightPercent)]).Single().AnnualWorth, stated.AnnualWorth, 1e-9);
        Assert.DoesNotContain("no value stated", unstated.Basis, StringComparison.Ordinal);
        Assert.Equal(years == 6 ? "study period of 6 years: the life itself" : "study period of 12 years: 2 lives of 6 periods, renewed on the same terms", unstated.Basis);
    }

    [Theory]
    [InlineData(5, "cut at period 5")]
    [InlineData(7, "renewed to cover 7 periods")]
    public void A_period_either_side_of_a_life_needs_the_stated_value_and_says_when_none_was_given(int years, string basis)
    {
        var unstated = ProposalRanking.Rank([new("Pump", Pump, EightPercent)], studyPeriodYears: years).Single();
        Assert.Contains(basis, unstated.Basis, StringComparison.Ordinal);
        Assert.EndsWith("no value stated, taken as zero", unstated.Basis, StringComparison.Ordinal);
    }

    [Fact]
    public void A_monthly_life_that_divides_the_study_period_needs_no_value()
    {
        // Eighteen months, a study period of three years: two whole lives of 18 periods (common practice, no source).
        var tooling = Models.Valid(18, 12, new SingleAmount("Tooling", Capital, 0, -9_000), new UniformSeries("Output", Revenue, 1, 18, 600));
        var ranked = ProposalRanking.Rank([new("Tooling", tooling, EightPercent)], studyPeriodYears: 3).Single();
        Assert.Equal("study period of 3 years: 2 lives of 18 periods, renewed on the same terms", ranked.Basis);
        Assert.Equal(ProposalRanking.Rank([new("Tooling", tooling, EightPercent)]).Single().AnnualWorth, ranked.AnnualWorth, 1e-9);
    }
}
