using CapReview.Engine.Comparison;
using CsCheck;

namespace CapReview.Engine.Tests.Comparison;

public class CapitalSelectionTests
{
    private static readonly TimeSpan Limit = TimeSpan.FromSeconds(10);

    [Fact]
    public void The_optimal_set_beats_the_greedy_fill_when_the_biggest_proposal_crowds_out_two_smaller_ones()
    {
        // Common practice, no source: the ranking's top proposal uses most of the budget; two smaller ones add more together.
        var problem = new SelectionProblem(
            [new("Big", 800, 500), new("Small A", 450, 300), new("Small B", 450, 290)],
            CapitalLimit: 1_000, ExclusiveGroups: [], Contingencies: []);
        var optimal = CapitalSelection.Optimal(problem, Limit);
        var greedy = CapitalSelection.Greedy(problem);
        Assert.True(optimal.ProvenOptimal);
        Assert.Equal(["Small A", "Small B"], optimal.Chosen);
        Assert.Equal(590, optimal.TotalWorth, 9);
        Assert.Equal(["Big"], greedy.Chosen);
        Assert.Equal(90, optimal.TotalWorth - greedy.TotalWorth, 9);
    }

    [Fact]
    public void Exclusive_groups_and_contingencies_are_respected()
    {
        var problem = new SelectionProblem(
            [new("Line A", 300, 200), new("Line B", 350, 260), new("Robot cell", 200, 150), new("Cell software", 50, 80)],
            CapitalLimit: 10_000,
            ExclusiveGroups: [["Line A", "Line B"]],
            Contingencies: [("Cell software", "Robot cell")]);
        var optimal = CapitalSelection.Optimal(problem, Limit);
        Assert.Equal(["Line B", "Robot cell", "Cell software"], optimal.Chosen);
        var noRobot = problem with { Candidates = [.. problem.Candidates.Select(c => c.Id == "Robot cell" ? c with { FirstCost = 20_000 } : c)] };
        Assert.DoesNotContain("Cell software", CapitalSelection.Optimal(noRobot, Limit).Chosen);
    }

    [Fact]
    public void A_limit_in_a_later_budget_year_keeps_out_a_proposal_that_needs_capital_then()
    {
        // Common practice, no source: a phased proposal needs most of its capital in budget year 1.
        var problem = new SelectionProblem(
            [new("Phased plant", 100, 400, [600]), new("Press", 300, 250), new("Dryer", 200, 150, [50])],
            CapitalLimit: 700, ExclusiveGroups: [], Contingencies: [], LaterYearLimits: [500]);
        var optimal = CapitalSelection.Optimal(problem, Limit);
        Assert.Equal(["Press", "Dryer"], optimal.Chosen);
        Assert.Equal(400, optimal.TotalWorth, 9);
        Assert.Equal(["Press", "Dryer"], CapitalSelection.Greedy(problem).Chosen);
        var wider = problem with { LaterYearLimits = [650] };
        Assert.Equal(["Phased plant", "Press", "Dryer"], CapitalSelection.Optimal(wider, Limit).Chosen);
    }

    [Fact]
    public void A_mandatory_group_is_funded_even_when_every_member_loses_money()
    {
        // Common practice, no source: a compliance requirement must be met by one of its ways, the cheapest in worth.
        var problem = new SelectionProblem(
            [new("Scrubber", 300, -120), new("Fuel switch", 200, -90), new("Conveyor", 400, 200)],
            CapitalLimit: 600, ExclusiveGroups: [], Contingencies: [], MandatoryGroups: [["Scrubber", "Fuel switch"]]);
        var optimal = CapitalSelection.Optimal(problem, Limit);
        Assert.True(optimal.Feasible);
        Assert.Equal(["Fuel switch", "Conveyor"], optimal.Chosen);
        Assert.Equal(110, optimal.TotalWorth, 9);
        Assert.Equal(["Fuel switch", "Conveyor"], CapitalSelection.Greedy(problem, byWorth: true).Chosen);

        // Down a ranking that puts the scrubber first, the greedy fill takes it and then cannot afford the conveyor.
        Assert.Equal(["Scrubber"], CapitalSelection.Greedy(problem).Chosen);

        var unaffordable = problem with { CapitalLimit = 150 };
        var none = CapitalSelection.Optimal(unaffordable, Limit);
        Assert.False(none.Feasible);
        Assert.True(none.ProvenOptimal);
        Assert.False(CapitalSelection.Greedy(unaffordable).Feasible);
        Assert.False(CapitalSelection.Exhaustive(unaffordable).Feasible);
    }

    [Fact]
    public void Proposals_that_lose_money_are_never_funded() =>
        Assert.Empty(CapitalSelection.Optimal(new SelectionProblem([new("Loser", 10, -5)], 100, [], []), Limit).Chosen);

    [Fact]
    public void The_frontier_never_falls_as_the_limit_rises()
    {
        var problem = new SelectionProblem([new("A", 100, 40), new("B", 200, 90), new("C", 300, 100), new("D", 150, 70)], 0, [], []);
        var frontier = CapitalSelection.Frontier(problem, [0, 100, 250, 400, 750], Limit);
        var worths = frontier.Select(f => f.Selection.TotalWorth).ToArray();
        Assert.Equal(worths.Order(), worths);
        Assert.Equal(300, worths[^1], 9);
    }

    [Fact]
    public void The_solver_equals_an_exhaustive_search_on_random_cycles_of_up_to_18_proposals()
    {
        var gen = Gen.Int[1, 18].SelectMany(n => Gen.Select(
            Gen.Select(Gen.Double[10, 1_000], Gen.Double[-200, 800], Gen.Double[0, 400]).Array[n, n],
            Gen.Int[0, n].Array[0, 4],
            Gen.Select(Gen.Int[0, n - 1], Gen.Int[0, n - 1]).Array[0, 5],
            Gen.Select(Gen.Double[0, 5_000], Gen.Double[0, 2_000], Gen.Bool, Gen.Bool),
            (values, groupSeeds, pairs, limits) => (values, groupSeeds, pairs, limits)));
        gen.Sample(t =>
        {
            var candidates = t.values.Select((v, k) => new SelectionCandidate($"p{k}", Math.Round(v.Item1, 2), Math.Round(v.Item2, 2),
                [Math.Round(v.Item3, 2)])).ToList();
            // Groups: pairs of neighbouring ids from the seeds (they may overlap); contingencies: random ordered pairs;
            // half the cycles have a second budget year, half make their first group mandatory.
            var groups = t.groupSeeds.Distinct().Order().Where(s => s + 1 < candidates.Count)
                .Select(s => (IReadOnlyList<string>)[$"p{s}", $"p{s + 1}"]).Take(2).ToList();
            var contingencies = t.pairs.Where(p => p.Item1 != p.Item2).Select(p => ($"p{p.Item1}", $"p{p.Item2}")).ToList();
            var (limit, later, withLaterYear, withMandatory) = t.limits;
            var mandatory = withMandatory ? groups.Take(1).ToList() : [];
            var problem = new SelectionProblem(candidates, Math.Round(limit, 2), [.. groups.Skip(mandatory.Count)], contingencies,
                withLaterYear ? [Math.Round(later, 2)] : null, mandatory);
            var optimal = CapitalSelection.Optimal(problem, Limit);
            var exhaustive = CapitalSelection.Exhaustive(problem);
            return optimal.ProvenOptimal && optimal.Feasible == exhaustive.Feasible && Math.Abs(optimal.TotalWorth - exhaustive.TotalWorth) < 0.005;
        }, iter: 150);
    }
}
