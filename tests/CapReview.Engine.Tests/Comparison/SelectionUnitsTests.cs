using CapReview.Engine.Comparison;

namespace CapReview.Engine.Tests.Comparison;

/// <summary>Amounts at the models' limits: in cents they pass the solver's 64-bit integers, so they are counted in coarser units.</summary>
public class SelectionUnitsTests
{
    [Fact]
    public void Worths_of_10_to_the_17_are_selected_as_the_smaller_ones_are()
    {
        // The small-number case scaled by 10^15 (the optimal pair of smaller proposals beats the largest, common
        // practice, no source): in cents 5 × 10^19 passes long.MaxValue ≈ 9.2 × 10^18.
        const double scale = 1e15;
        var problem = new SelectionProblem(
            [new("Big", 800 * scale, 500 * scale), new("Small A", 450 * scale, 300 * scale), new("Small B", 450 * scale, 290 * scale)],
            CapitalLimit: 1_000 * scale, ExclusiveGroups: [], Contingencies: []);
        var optimal = CapitalSelection.Optimal(problem, TimeSpan.FromSeconds(10));
        Assert.True(optimal.ProvenOptimal);
        Assert.Equal(["Small A", "Small B"], optimal.Chosen);
        Assert.Equal(590 * scale, optimal.TotalWorth, 590 * scale * 1e-15);
        Assert.Equal(["Big"], CapitalSelection.Greedy(problem).Chosen);
        Assert.Equal(["Small A", "Small B"], CapitalSelection.Exhaustive(problem).Chosen);
    }

    [Fact]
    public void A_capital_limit_past_every_integer_funds_every_worthwhile_proposal()
    {
        var problem = new SelectionProblem([new("A", 100, 10), new("B", 200, 20), new("C", 300, -5)], CapitalLimit: 1e300, ExclusiveGroups: [], Contingencies: []);
        Assert.Equal(["A", "B"], CapitalSelection.Optimal(problem, TimeSpan.FromSeconds(10)).Chosen);
        Assert.Equal(["A", "B"], CapitalSelection.Greedy(problem).Chosen);
        Assert.Equal(["A", "B"], CapitalSelection.Exhaustive(problem).Chosen);
    }

    [Fact]
    public void A_cancelled_selection_stops_before_solving()
    {
        var problem = new SelectionProblem([new("A", 100, 10)], CapitalLimit: 100, ExclusiveGroups: [], Contingencies: []);
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();
        Assert.Throws<OperationCanceledException>(() => CapitalSelection.Optimal(problem, TimeSpan.FromSeconds(10), cancelled.Token));
        Assert.Throws<OperationCanceledException>(() => CapitalSelection.Frontier(problem, [0, 100], TimeSpan.FromSeconds(1), cancelled.Token));
    }
}
