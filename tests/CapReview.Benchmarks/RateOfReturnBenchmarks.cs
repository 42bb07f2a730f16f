using BenchmarkDotNet.Attributes;
using CapReview.Engine.Measures;
using Microsoft.VisualBasic;

namespace CapReview.Benchmarks;

/// <summary>Target: the rate-of-return search at least 5 times faster than Microsoft.VisualBasic.Financial.IRR on conventional 40-period flows.</summary>
[MemoryDiagnoser]
public class RateOfReturnBenchmarks
{
    private double[][] _cases = [];
    private double[] _nonConventional = [];

    [GlobalSetup]
    public void Setup()
    {
        _cases = [.. Enumerable.Range(1, 16).Select(BenchmarkModels.ConventionalFlows)];
        _nonConventional = BenchmarkModels.NonConventionalFlows();
    }

    [Benchmark(Baseline = true, Description = "Microsoft.VisualBasic.Financial.IRR, 16 conventional cases")]
    public double VisualBasicIrr()
    {
        double sum = 0;
        foreach (double[] flows in _cases)
        {
            double[] copy = flows;
            sum += Financial.IRR(ref copy, 0.1);
        }
        return sum;
    }

    [Benchmark(Description = "RateOfReturnSearch.Find (every root), 16 conventional cases")]
    public double EveryRoot()
    {
        double sum = 0;
        foreach (double[] flows in _cases)
        {
            sum += RateOfReturnSearch.Find(flows, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual).Roots[0];
        }
        return sum;
    }

    [Benchmark(Description = "RateOfReturnSearch.Find, one non-conventional 40-period case (4 sign changes, full scan)")]
    public int NonConventional() => RateOfReturnSearch.Find(_nonConventional, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual).Roots.Count;
}
