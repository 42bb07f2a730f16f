using BenchmarkDotNet.Attributes;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Benchmarks;

/// <summary>
/// Issue 18: trials whose flows change sign several times used to take the full rate-of-return scan each, making a
/// simulation many times slower than one of a conventional model. The conventional 40-period benchmark model is the
/// anchor in the same run; beside it a quarry whose trials mostly have two rates of return, and the two searches on
/// the quarry's trial flows.
/// </summary>
[MemoryDiagnoser]
public class SimulatedRateOfReturnBenchmarks
{
    private const int Trials = 20_000;

    private static readonly ProposalCase Line = new(BenchmarkModels.Spec());

    private static readonly UncertainParameter[] LineParameters =
    [
        new("Line equipment", "elements[0].amount", -2_700_000, -2_400_000, -2_300_000),
        new("Labour saved", "elements[2].amount", 200_000, 260_000, 300_000, DistributionKind.Pert),
        new("Energy saved", "elements[3].amount", 60_000, 90_000, 110_000),
        new("Energy price growth", "elements[3].growth", 0.0, 0.025, 0.05, DistributionKind.Uniform),
        new("Maintenance", "elements[4].amount", -55_000, -40_000, -35_000),
        new("MARR", "rate", 0.07, 0.09, 0.12, DistributionKind.Normal),
    ];

    // An invented quarry: opening, fifteen years of receipts, an extension in year 8, the site's restoration at the end.
    private static readonly ProposalCase Quarry = new(new ModelSpec
    {
        Horizon = 15,
        Rate = new RateSpec { Value = 0.08 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Opening", Category = CashFlowCategory.Capital, Period = 0, Amount = -1_000_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Stone sold", Category = CashFlowCategory.Revenue, First = 1, Last = 15, Amount = 250_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Extension", Category = CashFlowCategory.Capital, Period = 8, Amount = -600_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Restoration", Category = CashFlowCategory.Operating, Period = 15, Amount = -2_500_000 },
        ],
    });

    private static readonly UncertainParameter[] QuarryParameters =
    [
        new("Stone sold", "elements[1].amount", 200_000, 250_000, 320_000),
        new("Extension", "elements[2].amount", -800_000, -600_000, -400_000, DistributionKind.Pert),
        new("Restoration", "elements[3].amount", -3_500_000, -1_500_000, -150_000, DistributionKind.Lognormal),
        new("MARR", "rate", 0.06, 0.08, 0.10, DistributionKind.Normal),
    ];

    private double[][] _quarryFlows = [];

    [GlobalSetup]
    public void Setup()
    {
        // A thousand of the quarry's trials, their flows as the simulation writes them.
        var compiled = CompiledTrials.TryCompile(Quarry, QuarryParameters)!;
        var space = compiled.NewWorkspace();
        var samplers = QuarryParameters.Select(p => new Sampler(p)).ToArray();
        var random = new Random(2027);
        _quarryFlows = [.. Enumerable.Range(0, 1_000).Select(_ =>
        {
            compiled.Run([.. samplers.Select(s => s.Draw(random))], space);
            return (double[])space.Flows.Clone();
        })];
    }

    [Benchmark(Baseline = true, Description = "Monte Carlo, 20,000 trials, conventional 40-period model (anchor)")]
    public double Conventional() => MonteCarlo.Run(Line, LineParameters, Trials, 2027).PresentWorth.Mean;

    [Benchmark(Description = "Monte Carlo, 20,000 trials, quarry (four sign changes, most trials two rates)")]
    public double SeveralSignChanges() => MonteCarlo.Run(Quarry, QuarryParameters, Trials, 2027).RateOfReturn.Mean;

    [Benchmark(Description = "RateOfReturnSearch.Find (every root), 1,000 quarry trials")]
    public int EveryRoot() => _quarryFlows.Sum(f => RateOfReturnSearch.Find(f, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual).Roots.Count);

    [Benchmark(Description = "RateOfReturnSearch.FindUnique (stops at a second root), 1,000 quarry trials")]
    public int UniqueOnly() => _quarryFlows.Count(f => RateOfReturnSearch.FindUnique(f, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual) is not null);
}
