using BenchmarkDotNet.Attributes;
using CapReview.Engine.Measures;

namespace CapReview.Benchmarks;

/// <summary>The parts of the rate-of-return search on the same 16 conventional cases, to see where its time goes.</summary>
[MemoryDiagnoser]
public class SearchPartsBenchmarks
{
    private double[][] _cases = [];

    [GlobalSetup]
    public void Setup() => _cases = [.. Enumerable.Range(1, 16).Select(BenchmarkModels.ConventionalFlows)];

    [Benchmark(Description = "Sign evidence (FlowSigns), 16 cases")]
    public double Signs()
    {
        double sum = 0;
        foreach (double[] flows in _cases)
        {
            sum += FlowSigns.Of(flows).Total;
        }
        return sum;
    }

    [Benchmark(Description = "One present worth by Horner's rule, 16 cases")]
    public double OneWorth()
    {
        double sum = 0;
        foreach (double[] flows in _cases)
        {
            sum += FlowWorth.PresentWorth(flows, 0.1);
        }
        return sum;
    }
}
