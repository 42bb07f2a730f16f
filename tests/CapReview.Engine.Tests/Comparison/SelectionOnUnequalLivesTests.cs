using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Engine.Tests.Support;
using CsCheck;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Engine.Tests.Comparison;

/// <summary>
/// The budget-constrained selection on alternatives of unequal lives: present worth over each one's own life favours
/// the one that serves fewer years; present worth of the chain over the lives' common multiple (the figures of the
/// incremental analysis) agrees with that analysis.
/// </summary>
public class SelectionOnUnequalLivesTests
{
    private static readonly AnnualRate EightPercent = AnnualRate.Effective(0.08);

    private static Alternative Alternative(string name, double firstCost, double yearly, CashFlowCategory category, int life) =>
        new(name, Models.Valid(life, 1, new SingleAmount("First cost", Capital, 0, -firstCost), new UniformSeries("Yearly", category, 1, life, yearly)));

    // A mandatory need (cost only) and an optional pair, each a three-year and a six-year way, at 8 %.
    private static readonly Alternative Short = Alternative("S", 30_000, -5_000, Operating, 3);
    private static readonly Alternative Long = Alternative("L", 50_000, -4_000, Operating, 6);
    private static readonly Alternative Quick = Alternative("A", 40_000, 18_000, Revenue, 3);
    private static readonly Alternative Lasting = Alternative("B", 70_000, 17_000, Revenue, 6);

    private static SelectionProblem Problem(Func<Alternative, double> worth) => new(
        [.. new[] { Short, Long, Quick, Lasting }.Select(a => new SelectionCandidate(a.Name, a.FirstCost, worth(a)))],
        1_000_000, [["A", "B"]], [], MandatoryGroups: [["S", "L"]]);

    [Fact]
    public void Present_worth_over_each_life_funds_the_alternatives_the_incremental_analysis_rejects()
    {
        // Hand-computed from the 8 % table of an engineering-economy handbook (from memory; four decimals, A/P five):
        // (P/A, 8%, 3) = 2.5771, (P/A, 8%, 6) = 4.6229. Tolerances are half a unit of the printed place times the amount.
        double Own(Alternative a) => ModelEvaluator.Evaluate(a.Model, new EvaluationOptions(EightPercent)).PresentWorth;
        Assert.Equal(-30_000 - 5_000 * 2.5771, Own(Short), 0.5);     // −42,885.5
        Assert.Equal(-50_000 - 4_000 * 4.6229, Own(Long), 0.5);      // −68,491.6
        Assert.Equal(-40_000 + 18_000 * 2.5771, Own(Quick), 1.0);    // 6,387.8
        Assert.Equal(-70_000 + 17_000 * 4.6229, Own(Lasting), 1.0);  // 8,589.3

        // Summing those, the selection takes the three-year need and the six-year pair member …
        Selection overOwnLives = CapitalSelection.Optimal(Problem(Own), TimeSpan.FromSeconds(10));
        Assert.Equal(["B", "S"], overOwnLives.Chosen.Order(StringComparer.Ordinal));

        // … while the incremental analysis takes the other two.
        var need = ExclusiveChoice.Decide([Short, Long], EightPercent, mandatory: true);
        var pair = ExclusiveChoice.Decide([Quick, Lasting], EightPercent, mandatory: false);
        Assert.Equal("L", need.BestByIncrementalAnalysis);
        Assert.Equal("A", pair.BestByIncrementalAnalysis);

        // Over the six-year common horizon the three-year ways are bought twice: PW(chain) = PW(life) (1 + (P/F, 8%, 3)),
        // (P/F, 8%, 3) = 0.7938 from the same table; and the annual worths, (A/P, 8%, 3) = 0.38803, (A/P, 8%, 6) = 0.21632.
        Assert.Equal((-30_000 - 5_000 * 2.5771) * (1 + 0.7938), need.PresentWorths["S"], 3.0);  // −76,927.9
        Assert.Equal(-50_000 - 4_000 * 4.6229, need.PresentWorths["L"], 0.5);                    // −68,491.6
        Assert.Equal((-40_000 + 18_000 * 2.5771) * (1 + 0.7938), pair.PresentWorths["A"], 1.0);  // 11,458.3
        Assert.Equal(-30_000 * 0.38803 - 5_000, need.AnnualWorths["S"], 0.5);                    // −16,640.9
        Assert.Equal(-50_000 * 0.21632 - 4_000, need.AnnualWorths["L"], 0.5);                    // −14,816.0
        Assert.Equal(-40_000 * 0.38803 + 18_000, pair.AnnualWorths["A"], 0.5);                   // 2,478.8
        Assert.Equal(-70_000 * 0.21632 + 17_000, pair.AnnualWorths["B"], 0.5);                   // 1,857.6

        // On those figures the selection agrees with the incremental analysis, by either objective.
        var chain = need.PresentWorths.Concat(pair.PresentWorths).ToDictionary();
        var annual = need.AnnualWorths.Concat(pair.AnnualWorths).ToDictionary();
        Assert.Equal(["A", "L"], CapitalSelection.Optimal(Problem(a => chain[a.Name]), TimeSpan.FromSeconds(10)).Chosen.Order(StringComparer.Ordinal));
        Assert.Equal(["A", "L"], CapitalSelection.Optimal(Problem(a => annual[a.Name]), TimeSpan.FromSeconds(10)).Chosen.Order(StringComparer.Ordinal));
    }

    [Fact]
    public void The_renewals_carry_one_life_to_the_chain_over_the_common_horizon()
    {
        // (1 + (P/F, 8%, 3)) = 1.7938 and 1 + (P/F, 8%, 2) + (P/F, 8%, 4) = 1 + 0.8573 + 0.7350 = 2.5923 from the
        // handbook's 8 % table (from memory, four decimals); one life is its own chain.
        Assert.Equal(1.7938, CommonHorizon.Renewals(0.08, 3, 6), 0.0001);
        Assert.Equal(2.5923, CommonHorizon.Renewals(0.08, 2, 6), 0.0002);
        Assert.Equal(1.0, CommonHorizon.Renewals(0.08, 6, 6), 1e-12);
        Assert.Throws<ArgumentOutOfRangeException>(() => CommonHorizon.Renewals(0.08, 4, 6));
    }

    [Fact]
    public void Over_a_study_period_that_cuts_a_life_the_analysis_compares_the_flows_within_it_with_the_stated_values()
    {
        // Four years at 8 %: the three-year way A is bought again at year 3 and valued at 20,000 at year 4; the six-year
        // way B is cut at year 4 at 30,000. Handbook 8 % table (from memory, four decimals): (P/A, 8%, 4) = 3.3121,
        // (P/F, 8%, 3) = 0.7938, (P/F, 8%, 4) = 0.7350, (A/P, 8%, 4) = 0.30192.
        var a = Quick with { ValueAtStudyEnd = 20_000 };
        var b = Lasting with { ValueAtStudyEnd = 30_000 };
        var overLives = ExclusiveChoice.Decide([a, b], EightPercent, mandatory: false);
        var overFour = ExclusiveChoice.Decide([a, b], EightPercent, mandatory: false, studyPeriodYears: 4);
        Assert.Equal("A", overLives.BestByIncrementalAnalysis);
        Assert.Equal(4, overFour.CommonHorizon);
        double pwA = -40_000 + 18_000 * 3.3121 - 40_000 * 0.7938 + 20_000 * 0.7350;  // 2,565.8
        double pwB = -70_000 + 17_000 * 3.3121 + 30_000 * 0.7350;                    // 8,355.7
        Assert.Equal(pwA, overFour.PresentWorths["A"], 4.0);
        Assert.Equal(pwB, overFour.PresentWorths["B"], 2.5);
        Assert.Equal(pwB * 0.30192, overFour.AnnualWorths["B"], 1.5);                 // 2,522.8
        Assert.Equal(pwB - pwA, overFour.Steps[^1].IncrementalPresentWorth, 6.5);
        Assert.Equal("B", overFour.BestByIncrementalAnalysis);
        Assert.Equal("B", overFour.BestByAnnualWorth);
        // ΔB/ΔC over the four years, the value at the end counted as salvage against the costs. A against nothing:
        // B = 18,000 (P/A, 8%, 4), C = 40,000 + 40,000 (P/F, 8%, 3) − 20,000 (P/F, 8%, 4). B against A: ΔC =
        // 30,000 − 40,000 (P/F, 8%, 3) − (30,000 − 20,000)(P/F, 8%, 4) = −9,102 is not positive, so no ratio.
        Assert.Equal(18_000 * 3.3121 / (40_000 + 40_000 * 0.7938 - 20_000 * 0.7350), overFour.Steps[0].IncrementalBenefitCost!.Value, 0.0001);  // 1.0450
        Assert.Null(overFour.Steps[^1].IncrementalBenefitCost);
    }

    [Fact]
    public void On_the_incremental_analysis_figures_the_selection_agrees_with_it_for_every_generated_group()
    {
        // Common practice, no source: with capital to spare and no contingencies, the set of greatest total worth takes
        // from each group its member of greatest worth (none from an optional group where none is worth more than
        // nothing), which the analysis picks when both compare the same chains at the same MARR. With a study period
        // (one in three cycles, 1 to 8 years, cutting lives as often as not) both compare each alternative's flows
        // within it with its stated value at the end, the ranking's worth over the study period.
        var alternative = Gen.Select(Gen.Double[1_000, 80_000], Gen.Double[-8_000, 25_000], Gen.Int[1, 6], Gen.Double[0, 10_000], Gen.Double[-5_000, 60_000])
            .Select((cost, yearly, life, salvage, atEnd) => (cost, yearly, life, salvage, atEnd));
        var group = Gen.Select(alternative.Array[1, 4], Gen.Bool);
        var study = Gen.Int[0, 2].SelectMany(k => k == 0 ? Gen.Int[1, 8].Select(y => (int?)y) : Gen.Const((int?)null));
        Gen.Select(group.Array[1, 3], Gen.Double[0.0, 0.30], Gen.Bool, study).Sample((groups, marr, annual, years) =>
        {
            var decisions = new List<ExclusiveDecision>();
            var candidates = new List<SelectionCandidate>();
            var exclusive = new List<IReadOnlyList<string>>();
            var mandatory = new List<IReadOnlyList<string>>();
            for (int g = 0; g < groups.Length; g++)
            {
                var members = groups[g].Item1.Select((m, k) => new Alternative($"g{g}-{k}", Models.Valid(m.life, 1,
                    new SingleAmount("First cost", Capital, 0, -m.cost),
                    new UniformSeries("Yearly", m.yearly >= 0 ? Revenue : Operating, 1, m.life, m.yearly),
                    new SingleAmount("Resale", Salvage, m.life, m.salvage)), m.atEnd)).ToList();
                var decision = ExclusiveChoice.Decide(members, AnnualRate.Effective(marr), groups[g].Item2, years);
                if (years is int t)
                {
                    // The analysis's figures are the ranking's over the study period.
                    var ranked = ProposalRanking.Rank([.. members.Select(m => new RankingEntry(m.Name, m.Model, AnnualRate.Effective(marr), m.ValueAtStudyEnd))], t);
                    if (ranked.Any(r => Math.Abs(r.PresentWorth - decision.PresentWorths[r.Id]) > 1e-6 * (1 + Math.Abs(r.PresentWorth))
                        || Math.Abs(r.AnnualWorth - decision.AnnualWorths[r.Id]) > 1e-6 * (1 + Math.Abs(r.AnnualWorth))))
                    {
                        return false;
                    }
                }
                decisions.Add(decision);
                var worths = annual ? decision.AnnualWorths : decision.PresentWorths;
                candidates.AddRange(members.Select(m => new SelectionCandidate(m.Name, m.FirstCost, worths[m.Name])));
                (groups[g].Item2 ? mandatory : exclusive).Add([.. members.Select(m => m.Name)]);
                // A near tie (within the solver's cent) may go either way.
                var top = worths.Values.Append(groups[g].Item2 ? double.NegativeInfinity : 0.0).OrderDescending().Take(2).ToArray();
                if (top.Length == 2 && Math.Abs(top[0] - top[1]) < 0.05)
                {
                    return true;
                }
            }
            var chosen = CapitalSelection.Exhaustive(new SelectionProblem(candidates, 1e9, exclusive, [], MandatoryGroups: mandatory)).Chosen.ToHashSet();
            return decisions.Select((d, g) => (d, g)).All(x =>
                chosen.SingleOrDefault(id => id.StartsWith($"g{x.g}-", StringComparison.Ordinal)) is var pick
                && (pick ?? ExclusiveChoice.DoNothing) == x.d.BestByIncrementalAnalysis);
        }, iter: 1_000);
    }
}
