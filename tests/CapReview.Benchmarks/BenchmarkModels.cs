using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using static CapReview.Engine.CashFlows.CashFlowCategory;

namespace CapReview.Benchmarks;

/// <summary>The benchmark's 40-period, 10-element model: a plant line with every element shape (invented figures).</summary>
internal static class BenchmarkModels
{
    public const int Horizon = 40;

    public static readonly ElementSpec[] Elements =
    [
        Single("Line equipment", Capital, 0, -2_400_000),
        Single("Installation", Capital, 1, -350_000),
        Uniform("Labour saved", Revenue, 2, 40, 260_000),
        Geometric("Energy saved", Revenue, 2, 40, 90_000, 0.025),
        Arithmetic("Maintenance", Operating, 2, 40, -40_000, -1_500),
        Uniform("Insurance", Operating, 1, 40, -12_000),
        Recurring("Spindle rebuild", Capital, 8, 32, 8, -180_000),
        Recurring("Controls refresh", Capital, 12, 36, 12, -95_000),
        Geometric("Consumables", Operating, 2, 40, -18_000, 0.02),
        Single("Resale of the line", Salvage, 40, 150_000),
    ];

    public static ModelSpec Spec() => new()
    {
        PeriodsPerYear = 1,
        Horizon = Horizon,
        Rate = new RateSpec { Value = 0.09, Basis = Engine.Rates.RateBasis.Effective },
        Elements = Elements,
    };

    /// <summary>The benchmark model with every amount scaled by its own factor in [0.6, 1.4): one of a cycle's many proposals.</summary>
    public static ModelSpec VariedSpec(Random random)
    {
        ArgumentNullException.ThrowIfNull(random);
        return Spec() with { Elements = [.. Elements.Select(e => e with { Amount = Math.Round(e.Amount!.Value * (0.6 + 0.8 * random.NextDouble()), 2) })] };
    }

    /// <summary>Conventional 40-period flows: one outlay, then receipts that vary from year to year.</summary>
    public static double[] ConventionalFlows(int seed)
    {
        var random = new Random(seed);
        double[] flows = new double[Horizon + 1];
        flows[0] = -1_000_000;
        for (int t = 1; t <= Horizon; t++)
        {
            flows[t] = 40_000 + random.NextDouble() * 160_000;
        }
        return flows;
    }

    /// <summary>An outlay followed by receipts and payments that alternate in waves: four sign changes, no rate of return.</summary>
    public static double[] NonConventionalFlows()
    {
        double[] flows = new double[Horizon + 1];
        flows[0] = -1000;
        for (int t = 1; t <= Horizon; t++)
        {
            flows[t] = 150 * Math.Sin(t * 0.3) + 20;
        }
        return flows;
    }

    private static ElementSpec Single(string label, CashFlowCategory category, int period, double amount) =>
        new() { Type = ElementKind.Single, Label = label, Category = category, Period = period, Amount = amount };

    private static ElementSpec Uniform(string label, CashFlowCategory category, int first, int last, double amount) =>
        new() { Type = ElementKind.Uniform, Label = label, Category = category, First = first, Last = last, Amount = amount };

    private static ElementSpec Arithmetic(string label, CashFlowCategory category, int first, int last, double amount, double step) =>
        new() { Type = ElementKind.Arithmetic, Label = label, Category = category, First = first, Last = last, Amount = amount, Step = step };

    private static ElementSpec Geometric(string label, CashFlowCategory category, int first, int last, double amount, double growth) =>
        new() { Type = ElementKind.Geometric, Label = label, Category = category, First = first, Last = last, Amount = amount, Growth = growth };

    private static ElementSpec Recurring(string label, CashFlowCategory category, int first, int last, int every, double amount) =>
        new() { Type = ElementKind.Recurring, Label = label, Category = category, First = first, Last = last, Every = every, Amount = amount };
}
