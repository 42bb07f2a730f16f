using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Risk;

namespace CapReview.Reviews.Tests.Risk;

/// <summary>
/// The domain's risk service on a plant that costs 400,000 now and saves 70,000 a year for 10 years at a MARR of 10 %.
/// Every expected value is worked out here from the uniform-series present-worth factor, not read from the service.
/// </summary>
public sealed class ProposalRiskTests
{
    private const double Cost = 400_000, Low = 50_000, Likely = 70_000, High = 90_000;

    /// <summary>(P/A, 10 %, 10) = (1 − 1.1^−10) / 0.1, the standard uniform-series present-worth factor.</summary>
    private static readonly double SeriesFactor = (1 - Math.Pow(1.1, -10)) / 0.1;

    private static ModelSpec Plant() => new()
    {
        Horizon = 10,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Id = "plant", Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -Cost },
            new ElementSpec { Id = "saving", Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = Likely },
        ],
    };

    private static RiskSpec Saving(DistributionKind distribution = DistributionKind.Triangular, int trials = 20_000, int seed = 2027) => new()
    {
        Trials = trials,
        Seed = seed,
        Parameters = [new ParameterSpec { Name = "Saving", Target = "elements[#saving].amount", Low = Low, MostLikely = Likely, High = High, Distribution = distribution }],
    };

    private static RiskStudy Study(RiskSpec risk) => ProposalRisk.Prepare(new ProposalCase(Plant()), risk).Value!;

    [Fact]
    public void The_tornado_swing_and_the_break_even_are_the_hand_computed_ones()
    {
        var result = ProposalRisk.Analyse(Study(Saving()));

        // Hand computation with the standard factor: PW = −400,000 + saving × (P/A, 10 %, 10), (P/A) = 6.144567.
        var bar = Assert.Single(result.Tornado);
        Assert.Equal(-Cost + Low * SeriesFactor, bar.AtLow, 6);
        Assert.Equal(-Cost + High * SeriesFactor, bar.AtHigh, 6);
        Assert.Equal((High - Low) * SeriesFactor, bar.Swing, 6);
        Assert.Equal(-Cost + Likely * SeriesFactor, result.Basis, 6);
        // Break-even saving: 400,000 / 6.144567 = 65,098.16.
        Assert.Equal(Cost / SeriesFactor, Assert.Single(result.BreakEvens).Value!.Value, 4);
        // Pessimistic and optimistic scenarios: every parameter at the end that lowers, then raises, present worth.
        Assert.Equal(["Pessimistic", "Most likely", "Optimistic"], result.Scenarios.Select(s => s.Name));
        Assert.Equal(bar.AtLow, result.Scenarios[0].PresentWorth, 6);
        Assert.Equal(bar.AtHigh, result.Scenarios[2].PresentWorth, 6);
    }

    [Fact]
    public void The_spider_moves_the_most_likely_value_by_each_step()
    {
        var line = Assert.Single(ProposalRisk.Analyse(Study(Saving())).Spider);
        Assert.Equal(11, line.Points.Count);
        // At −50 %: a saving of 35,000, PW = −400,000 + 35,000 × (P/A, 10 %, 10).
        Assert.Equal(-0.5, line.Points[0].Change, 12);
        Assert.Equal(-Cost + Likely * 0.5 * SeriesFactor, line.Points[0].Measure, 6);
    }

    [Fact]
    public void The_same_seed_gives_the_same_summary_and_another_seed_another()
    {
        var first = ProposalRisk.Simulate(Study(Saving(seed: 7)));
        var again = ProposalRisk.Simulate(Study(Saving(seed: 7)));
        var other = ProposalRisk.Simulate(Study(Saving(seed: 8)));

        Assert.Equal((first.Trials, first.Seed, first.Mean, first.StandardDeviation, first.ProbabilityOfLoss, first.Percentiles, first.Invalid),
            (again.Trials, again.Seed, again.Mean, again.StandardDeviation, again.ProbabilityOfLoss, again.Percentiles, again.Invalid));
        Assert.Equal(first.Histogram, again.Histogram);
        Assert.NotEqual(first.Mean, other.Mean);
    }

    [Fact]
    public void The_probability_of_a_loss_and_the_percentiles_match_the_uniform_distribution()
    {
        // A uniform saving on [50,000, 90,000]: PW is linear in it, so PW < 0 exactly when the saving is below the
        // break-even 400,000 / (P/A) and P(loss) = (break-even − 50,000) / 40,000 = 0.3775 (the uniform CDF; common
        // practice, no source). With 200,000 trials the sampling error's standard deviation is about 0.0011.
        var summary = ProposalRisk.Simulate(Study(Saving(DistributionKind.Uniform, trials: 200_000)));
        double breakEven = Cost / SeriesFactor;
        Assert.Equal((breakEven - Low) / (High - Low), summary.ProbabilityOfLoss, 2);
        Assert.Equal(200_000, summary.Trials);
        Assert.Equal(0, summary.Invalid);

        // The p-th percentile of PW is PW at the p-th percentile of the saving, 50,000 + 40,000 p.
        double At(double p) => -Cost + (Low + (High - Low) * p) * SeriesFactor;
        double tolerance = 0.01 * (High - Low) * SeriesFactor;
        Assert.InRange(summary.Percentiles.P5, At(0.05) - tolerance, At(0.05) + tolerance);
        Assert.InRange(summary.Percentiles.P25, At(0.25) - tolerance, At(0.25) + tolerance);
        Assert.InRange(summary.Percentiles.P50, At(0.50) - tolerance, At(0.50) + tolerance);
        Assert.InRange(summary.Percentiles.P90, At(0.90) - tolerance, At(0.90) + tolerance);
        // Mean of a uniform: the midpoint, 70,000; standard deviation 40,000 / √12, both times (P/A).
        Assert.InRange(summary.Mean, At(0.5) - tolerance, At(0.5) + tolerance);
        double deviation = 40_000 / Math.Sqrt(12) * SeriesFactor;
        Assert.InRange(summary.StandardDeviation, deviation * 0.99, deviation * 1.01);
        Assert.Equal(40, summary.Histogram.Count);
        Assert.Equal(200_000, summary.Histogram.Sum(b => b.Count));
    }

    [Fact]
    public void More_trials_than_the_limit_are_refused_naming_the_field()
    {
        var outcome = ProposalRisk.Prepare(new ProposalCase(Plant()), Saving(trials: ProposalRisk.MaxTrials + 1));
        Assert.False(outcome.IsValid);
        Assert.Equal("risk.trials", Assert.Single(outcome.Errors).Field);
        Assert.True(ProposalRisk.Prepare(new ProposalCase(Plant()), Saving(trials: ProposalRisk.MaxTrials)).IsValid);
    }

    [Fact]
    public void An_incomplete_model_or_no_parameter_is_named_not_analysed()
    {
        var incomplete = ProposalRisk.Prepare(new ProposalCase(Plant() with { Horizon = null }), Saving());
        Assert.Equal("model", incomplete.Errors[0].Field);
        var none = ProposalRisk.Prepare(new ProposalCase(Plant()), new RiskSpec { Parameters = [] });
        Assert.Equal("risk.parameters", Assert.Single(none.Errors).Field);
    }

    [Fact]
    public void A_cancelled_simulation_stops()
    {
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => ProposalRisk.Simulate(Study(Saving()), cancellationToken: cancel.Token));
    }

    [Fact]
    public void After_tax_the_figures_follow_the_after_tax_flows()
    {
        // 25 % tax, straight-line over 10 years: 40,000 a year deducted, so the tax is 25 % × (saving − 40,000) and
        // each year's flow 0.75 × saving + 10,000, discounted at the stated 7.5 % after-tax MARR.
        var tax = new TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 10 },
            AfterTaxMarr = new RateSpec { Value = 0.075 },
        };
        var study = ProposalRisk.Prepare(new ProposalCase(Plant(), tax), Saving()).Value!;
        Assert.True(study.AfterTax);
        double factor = (1 - Math.Pow(1.075, -10)) / 0.075;
        var bar = Assert.Single(ProposalRisk.Analyse(study).Tornado);
        Assert.Equal(-Cost + (0.75 * Low + 10_000) * factor, bar.AtLow, 5);
        Assert.Equal(-Cost + (0.75 * High + 10_000) * factor, bar.AtHigh, 5);
    }
}
