using BenchmarkDotNet.Attributes;
using CapReview.Engine.Comparison;

namespace CapReview.Benchmarks;

/// <summary>Target: the optimal selection for 200 proposals with 20 exclusive groups and 30 contingencies under 2 s.</summary>
[MemoryDiagnoser]
public class SelectionBenchmarks
{
    private SelectionProblem _problem = null!;

    [GlobalSetup]
    public void Setup()
    {
        var random = new Random(2027);
        var candidates = Enumerable.Range(0, 200)
            .Select(k => new SelectionCandidate($"p{k}", Math.Round(20_000 + random.NextDouble() * 480_000, 2), Math.Round(-20_000 + random.NextDouble() * 220_000, 2)))
            .ToList();
        var groups = Enumerable.Range(0, 20).Select(g => (IReadOnlyList<string>)[.. Enumerable.Range(0, 3).Select(j => $"p{g * 3 + j}")]).ToList();
        var contingencies = Enumerable.Range(0, 30).Select(c => ($"p{100 + c}", $"p{140 + c}")).ToList();
        // A limit that binds: about a third of the total first cost.
        _problem = new SelectionProblem(candidates, Math.Round(candidates.Sum(c => c.FirstCost) / 3, 2), groups, contingencies);
    }

    [Benchmark(Description = "CP-SAT optimal selection, 200 proposals, 20 groups, 30 contingencies")]
    public double Optimal() => CapitalSelection.Optimal(_problem, TimeSpan.FromSeconds(10)).TotalWorth;

    [Benchmark(Description = "Greedy fill by worth, same cycle")]
    public double Greedy() => CapitalSelection.Greedy(_problem, byWorth: true).TotalWorth;
}
