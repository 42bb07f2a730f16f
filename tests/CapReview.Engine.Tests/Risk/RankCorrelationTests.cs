using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using Correlation = CapReview.Engine.Risk.Correlation;
using Statistics = MathNet.Numerics.Statistics.Correlation;

namespace CapReview.Engine.Tests.Risk;

public class RankCorrelationTests
{
    private static readonly ProposalCase Plant = new(new ModelSpec
    {
        Horizon = 10,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Output", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 80_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Energy", Category = CashFlowCategory.Operating, First = 1, Last = 10, Amount = -10_000 },
        ],
    });

    private static readonly UncertainParameter[] Parameters =
    [
        new("Output", "elements[1].amount", 60_000, 80_000, 100_000),
        new("Energy", "elements[2].amount", -16_000, -10_000, -8_000),
    ];

    [Fact]
    public void A_wanted_rank_correlation_is_induced_and_each_parameter_keeps_its_own_values()
    {
        // R. L. Iman and W. J. Conover (1982), from memory: the induced Spearman correlation is close to the target.
        // Output and energy cost move together (more output, more energy used): output up, energy amount down.
        var independent = MonteCarlo.Run(Plant, Parameters, 20_000, seed: 5);
        var correlated = MonteCarlo.Run(Plant, Parameters, 20_000, seed: 5, correlations: [new Correlation("Output", "Energy", -0.8)]);
        // Opposed movements narrow the spread of worth: a strong negative pairing of a receipt and a cost.
        Assert.True(correlated.PresentWorth.StandardDeviation < independent.PresentWorth.StandardDeviation * 0.95);
        // The pairing moves values between trials but the mean of an affine worth keeps its expectation.
        Assert.Equal(independent.PresentWorth.Mean, correlated.PresentWorth.Mean, independent.PresentWorth.StandardDeviation * 0.05);
    }

    [Fact]
    public void The_reordering_keeps_the_drawn_values_and_reaches_the_target_rank_correlation()
    {
        var random = new Random(11);
        const int rows = 2_000;
        double[][] samples = [[.. Enumerable.Range(0, rows).Select(_ => random.NextDouble())], [.. Enumerable.Range(0, rows).Select(_ => random.NextDouble() * 5)]];
        double[][] before = [[.. samples[0]], [.. samples[1]]];
        RankCorrelation.Of(Parameters, [new Correlation("Output", "Energy", 0.7)])!.Apply(samples, rows, random);
        Assert.Equal(before[0].Order(), samples[0].Order());
        Assert.Equal(before[1].Order(), samples[1].Order());
        Assert.Equal(0.7, Statistics.Spearman(samples[0], samples[1]), 0.05);
    }

    [Fact]
    public void Inconsistent_correlations_are_refused()
    {
        UncertainParameter[] three = [.. Parameters, new("MARR", "rate", 0.08, 0.10, 0.12)];
        Assert.Throws<ArgumentException>(() => MonteCarlo.Run(Plant, three, 10, 1,
            correlations: [new("Output", "Energy", 0.95), new("Output", "MARR", 0.95), new("Energy", "MARR", -0.95)]));
        Assert.Throws<ArgumentException>(() => MonteCarlo.Run(Plant, Parameters, 10, 1, correlations: [new("Output", "Nothing", 0.5)]));
    }
}
