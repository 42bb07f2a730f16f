using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using MathNet.Numerics.Distributions;
using Microsoft.VisualBasic;

namespace CapReview.Engine.Tests.Risk;

public class RiskTests
{
    // An invented retrofit: 400,000 now, a level saving for ten years, an upkeep cost, a resale; at 10 %.
    private static readonly ProposalCase Retrofit = new(new ModelSpec
    {
        Horizon = 10,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Retrofit", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Energy saved", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 70_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Upkeep", Category = CashFlowCategory.Operating, First = 1, Last = 10, Amount = -5_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 10, Amount = 20_000 },
        ],
    });

    private static readonly UncertainParameter Saving = new("Energy saved", "elements[1].amount", 50_000, 70_000, 100_000);

    // Outside reference for every expected worth: Microsoft.VisualBasic.Financial.PV at 10 % over ten years.
    private static readonly double Annuity = -Financial.PV(0.10, 10, 1);

    [Fact]
    public void The_tornado_puts_the_widest_swing_first()
    {
        // Hand-checked (marked as such): swings in PW are 50,000 × 6.1446 = 307,228 for the saving, 200,000 for the
        // first cost, 4,000 × 6.1446 = 24,578 for upkeep.
        UncertainParameter[] parameters =
        [
            new("Upkeep", "elements[2].amount", -7_000, -5_000, -3_000),
            new("First cost", "elements[0].amount", -500_000, -400_000, -300_000),
            Saving,
        ];
        var bars = Sensitivity.Tornado(Retrofit, parameters, RiskMeasure.PresentWorth);
        Assert.Equal(["Energy saved", "First cost", "Upkeep"], bars.Select(b => b.Parameter.Name));
        Assert.Equal(50_000 * Annuity, bars[0].Swing, 6);
        Assert.Equal(200_000, bars[1].Swing, 6);
        Assert.Equal(4_000 * Annuity, bars[2].Swing, 6);
    }

    [Fact]
    public void The_spider_moves_each_parameter_by_a_share_of_its_most_likely_value()
    {
        var lines = Sensitivity.Spider(Retrofit, [Saving], RiskMeasure.PresentWorth, Sensitivity.SpiderChanges);
        var points = lines.Single().Points;
        Assert.Equal(11, points.Count);
        double basis = -400_000 + 65_000 * Annuity + 20_000 * Financial.PV(0.10, 10, 0, -1);
        Assert.Equal(basis, points.Single(p => p.Change == 0).Measure, 6);
        Assert.Equal(basis - 35_000 * Annuity, points.Single(p => p.Change == -0.5).Measure, 6);
    }

    [Fact]
    public void The_break_even_value_makes_the_present_worth_zero()
    {
        double value = BreakEven.Find(Retrofit, "elements[1].amount", 0, 200_000)!.Value;
        Assert.True(Math.Abs(Retrofit.With("elements[1].amount", value).Measure(RiskMeasure.PresentWorth)) < 1e-9 * 400_000);
        // Hand computation: (400,000 − 20,000 (P/F)) / (P/A) + 5,000.
        Assert.Equal((400_000 - 20_000 * Financial.PV(0.10, 10, 0, -1)) / Annuity + 5_000, value, 6);
        Assert.Null(BreakEven.Find(Retrofit, "elements[1].amount", 100_000, 200_000));
        double rate = BreakEven.Find(Retrofit, "rate", 0.0, 0.5)!.Value;
        Assert.Equal(Retrofit.Evaluate().Value!.UniqueRateOfReturn!.Value, rate, 9);
    }

    [Fact]
    public void Scenarios_put_every_parameter_at_its_unfavourable_or_favourable_end()
    {
        UncertainParameter[] parameters = [Saving, new("First cost", "elements[0].amount", -450_000, -400_000, -380_000)];
        var results = Scenarios.Evaluate(Retrofit, parameters, [new Scenario("Energy prices fall", new Dictionary<string, double> { ["elements[1].amount"] = 55_000 })]);
        Assert.Equal(["Pessimistic", "Most likely", "Optimistic", "Energy prices fall"], results.Select(r => r.Name));
        double pf = Financial.PV(0.10, 10, 0, -1);
        Assert.Equal(-450_000 + 45_000 * Annuity + 20_000 * pf, results[0].PresentWorth, 6);
        Assert.Equal(-380_000 + 95_000 * Annuity + 20_000 * pf, results[2].PresentWorth, 6);
        Assert.Equal(-400_000 + 50_000 * Annuity + 20_000 * pf, results[3].PresentWorth, 6);
    }

    [Fact]
    public void A_triangular_saving_gives_the_triangular_mean_and_percentiles_of_a_linear_worth()
    {
        // Common practice, no source: PW is affine in the saving, so E[PW] = PW at E[saving] = (a + m + b)/3, and each
        // percentile of PW is PW at that percentile of the triangular distribution (MathNet.Numerics' InvCDF).
        const int trials = 100_000;
        var result = MonteCarlo.Run(Retrofit, [Saving], trials, seed: 2027);
        double pf = Financial.PV(0.10, 10, 0, -1);
        double Pw(double saving) => -400_000 + (saving - 5_000) * Annuity + 20_000 * pf;
        var triangular = new Triangular(50_000, 100_000, 70_000);
        double sd = triangular.StdDev * Annuity;
        Assert.InRange(result.PresentWorth.Mean, Pw(triangular.Mean) - 4 * sd / Math.Sqrt(trials), Pw(triangular.Mean) + 4 * sd / Math.Sqrt(trials));
        Assert.Equal(sd, result.PresentWorth.StandardDeviation, sd * 0.02);
        Assert.Equal(Pw(triangular.InverseCumulativeDistribution(0.05)), result.PresentWorth.P5, sd * 0.02);
        Assert.Equal(Pw(triangular.InverseCumulativeDistribution(0.95)), result.PresentWorth.P95, sd * 0.02);
        // P(PW < 0) = P(saving below the break-even), from the triangular CDF.
        double breakEven = BreakEven.Find(Retrofit, "elements[1].amount", 0, 200_000)!.Value;
        Assert.Equal(triangular.CumulativeDistribution(breakEven), result.ProbabilityOfLoss, 0.01);
        Assert.Equal(trials, result.Histogram.Sum(b => b.Count));
        Assert.Equal(101, result.Cumulative.Count);
    }

    [Fact]
    public void The_same_seed_gives_the_same_numbers_and_another_seed_other_ones()
    {
        UncertainParameter[] parameters = [Saving with { Distribution = DistributionKind.Pert }, new("MARR", "rate", 0.08, 0.10, 0.13, DistributionKind.Normal)];
        var first = MonteCarlo.Run(Retrofit, parameters, 5_000, seed: 42);
        var second = MonteCarlo.Run(Retrofit, parameters, 5_000, seed: 42);
        Assert.Equal(first.PresentWorth, second.PresentWorth);
        Assert.Equal(first.Cumulative, second.Cumulative);
        Assert.NotEqual(first.PresentWorth.Mean, MonteCarlo.Run(Retrofit, parameters, 5_000, seed: 43).PresentWorth.Mean);
    }

    [Fact]
    public void A_simulation_with_every_kind_of_distribution_gives_valid_trials_and_refuses_bad_parameters()
    {
        // Each distribution's bounds and percentiles are checked on its draws in DistributionDrawTests.
        UncertainParameter[] parameters =
        [
            Saving with { Distribution = DistributionKind.Uniform },
            new("Upkeep", "elements[2].amount", -8_000, -5_000, -4_000, DistributionKind.Lognormal),
            new("Resale", "elements[3].amount", 0, 20_000, 30_000, DistributionKind.Discrete, [new(0, 0.2), new(20_000, 0.5), new(30_000, 0.3)]),
        ];
        var result = MonteCarlo.Run(Retrofit, parameters, 2_000, seed: 7);
        Assert.Equal(0, result.Invalid);
        Assert.Throws<ArgumentException>(() => MonteCarlo.Run(Retrofit, [Saving with { Low = 80_000 }], 10, 1));
        Assert.Throws<ArgumentException>(() => MonteCarlo.Run(Retrofit, [new("x", "elements[3].amount", 0, 1, 2, DistributionKind.Discrete, [new(1, 0.5)])], 10, 1));
    }

    [Fact]
    public void A_cancelled_run_stops()
    {
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();
        Assert.Throws<OperationCanceledException>(() => MonteCarlo.Run(Retrofit, [Saving], 100_000, 1, cancellationToken: cancel.Token));
    }
}
