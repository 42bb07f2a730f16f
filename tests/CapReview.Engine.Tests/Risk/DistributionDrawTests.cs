using CapReview.Engine.Risk;
using MathNet.Numerics.Distributions;

namespace CapReview.Engine.Tests.Risk;

/// <summary>
/// Each distribution's draws against what docs/methods.md promises of it: bounds never passed, stated percentiles
/// held. With n draws the share at or below the true q-quantile is binomial, with standard error √(q(1 − q)/n)
/// (common practice, no source); each share must fall within four of them, a chance of about 6 in 100,000 of a false
/// alarm per check, and the seeds are fixed, so the outcome is the same on every run.
/// </summary>
public class DistributionDrawTests
{
    private const int Draws = 200_000;
    private static readonly double[] Levels = [0.05, 0.25, 0.50, 0.75, 0.95];

    private static double[] Draw(UncertainParameter parameter, int seed)
    {
        var sampler = new Sampler(parameter);
        var random = new Random(seed);
        var draws = new double[Draws];
        for (int k = 0; k < Draws; k++)
        {
            draws[k] = sampler.Draw(random);
        }
        return draws;
    }

    /// <summary>The share of draws at or below <paramref name="quantile"/> is q within four binomial standard errors.</summary>
    private static void HoldsPercentile(double[] draws, double q, double quantile)
    {
        double share = draws.Count(d => d <= quantile) / (double)draws.Length;
        double error = Math.Sqrt(q * (1 - q) / draws.Length);
        Assert.True(Math.Abs(share - q) <= 4 * error,
            $"{share:0.00000} of the draws lie at or below the {q:0.00} quantile {quantile:0.####}; expected {q:0.00} ± {4 * error:0.00000}");
    }

    /// <summary>The mean of the draws within four standard errors of the distribution's mean.</summary>
    private static void HoldsMean(double[] draws, double mean, double standardDeviation) =>
        Assert.InRange(draws.Average(), mean - 4 * standardDeviation / Math.Sqrt(Draws), mean + 4 * standardDeviation / Math.Sqrt(Draws));

    private static void StaysWithin(double[] draws, double low, double high)
    {
        Assert.True(draws.Min() >= low, $"a draw {draws.Min()} below the low value {low}");
        Assert.True(draws.Max() <= high, $"a draw {draws.Max()} above the high value {high}");
    }

    [Fact]
    public void Uniform_draws_stay_within_low_and_high_and_spread_evenly()
    {
        // Closed form: the q-quantile of the uniform on a … b is a + q (b − a); mean (a + b)/2, sd (b − a)/√12.
        var draws = Draw(new("Saving", "elements[1].amount", 50_000, 70_000, 100_000, DistributionKind.Uniform), seed: 11);
        StaysWithin(draws, 50_000, 100_000);
        foreach (double q in Levels)
        {
            HoldsPercentile(draws, q, 50_000 + q * 50_000);
        }
        HoldsMean(draws, 75_000, 50_000 / Math.Sqrt(12));
    }

    [Fact]
    public void Triangular_draws_stay_within_low_and_high_and_follow_the_triangle()
    {
        // Reference: MathNet.Numerics' Triangular(lower, upper, mode).InverseCumulativeDistribution; mean (a + m + b)/3.
        var draws = Draw(new("Saving", "elements[1].amount", 50_000, 70_000, 100_000, DistributionKind.Triangular), seed: 12);
        var triangular = new Triangular(50_000, 100_000, 70_000);
        StaysWithin(draws, 50_000, 100_000);
        foreach (double q in Levels)
        {
            HoldsPercentile(draws, q, triangular.InverseCumulativeDistribution(q));
        }
        HoldsMean(draws, (50_000 + 70_000 + 100_000) / 3.0, triangular.StdDev);
    }

    [Fact]
    public void Pert_draws_stay_within_low_and_high_and_follow_the_beta()
    {
        // Reference: the PERT as a beta on a … b with α = 1 + 4 (m − a)/(b − a), β = 1 + 4 (b − m)/(b − a) (D. Vose,
        // Risk Analysis, 3rd ed., 2008, from memory), quantiles from MathNet.Numerics' Beta; mean (a + 4m + b)/6.
        const double a = -500_000, m = -400_000, b = -380_000;
        var draws = Draw(new("First cost", "elements[0].amount", a, m, b, DistributionKind.Pert), seed: 13);
        var beta = new Beta(1 + 4 * (m - a) / (b - a), 1 + 4 * (b - m) / (b - a));
        StaysWithin(draws, a, b);
        foreach (double q in Levels)
        {
            HoldsPercentile(draws, q, a + (b - a) * beta.InverseCumulativeDistribution(q));
        }
        HoldsMean(draws, (a + 4 * m + b) / 6, (b - a) * beta.StdDev);
    }

    [Theory]
    [InlineData(0.08, 0.10, 0.12)]
    [InlineData(0.08, 0.09, 0.13)]
    public void Normal_draws_stay_within_low_and_high_and_follow_the_normal_cut_there(double low, double likely, double high)
    {
        // The normal about the most likely value with σ = (high − low)/(2 z₉₅), conditioned on low … high: its
        // q-quantile is μ + σ Φ⁻¹(Φ(α) + q (Φ(β) − Φ(α))), α and β the bounds in standard units (the truncated normal,
        // N. L. Johnson, S. Kotz and N. Balakrishnan, Continuous Univariate Distributions 1, 2nd ed., 1994, ch. 13,
        // from memory); Φ and Φ⁻¹ from MathNet.Numerics.
        double sigma = (high - low) / (2 * Normal.InvCDF(0, 1, 0.95));
        double from = Normal.CDF(likely, sigma, low), to = Normal.CDF(likely, sigma, high);
        var draws = Draw(new("MARR", "rate", low, likely, high, DistributionKind.Normal), seed: 14);
        StaysWithin(draws, low, high);
        foreach (double q in Levels)
        {
            HoldsPercentile(draws, q, Normal.InvCDF(likely, sigma, from + q * (to - from)));
        }
    }

    [Theory]
    [InlineData(4_000, 5_000, 8_000)]
    [InlineData(-8_000, -5_000, -4_000)]
    [InlineData(1_000, 1_200, 50_000)]
    public void Lognormal_draws_have_low_and_high_as_their_5th_and_95th_percentiles(double low, double likely, double high)
    {
        // The promise of docs/methods.md: low and high are the 5th and 95th percentiles (for costs, of the magnitudes,
        // the sign kept). The median of a lognormal with those percentiles is their geometric mean; its mean
        // e^(μ + σ²/2) and standard deviation from MathNet.Numerics' LogNormal.
        double z = Normal.InvCDF(0, 1, 0.95);
        double a = Math.Min(Math.Abs(low), Math.Abs(high)), b = Math.Max(Math.Abs(low), Math.Abs(high));
        double mu = 0.5 * (Math.Log(a) + Math.Log(b)), sigma = (Math.Log(b) - Math.Log(a)) / (2 * z);
        var magnitude = new LogNormal(mu, sigma);
        var draws = Draw(new("Upkeep", "elements[2].amount", low, likely, high, DistributionKind.Lognormal), seed: 15);
        Assert.All(draws, d => Assert.Equal(Math.Sign(likely), Math.Sign(d)));
        HoldsPercentile(draws, 0.05, low);
        HoldsPercentile(draws, 0.50, Math.Sign(likely) * Math.Sqrt(a * b));
        HoldsPercentile(draws, 0.95, high);
        HoldsMean(draws, Math.Sign(likely) * magnitude.Mean, magnitude.StdDev);
    }

    [Fact]
    public void Lognormal_with_low_equal_to_high_gives_that_value()
    {
        var draws = Draw(new("Upkeep", "elements[2].amount", -5_000, -5_000, -5_000, DistributionKind.Lognormal), seed: 16);
        Assert.All(draws, d => Assert.Equal(-5_000, d));
    }

    [Theory]
    [InlineData(0, 1, 2)]
    [InlineData(-1, 1, 2)]
    [InlineData(-2, -1, 0)]
    public void Lognormal_values_must_share_one_sign_and_none_be_zero(double low, double likely, double high) =>
        Assert.Throws<ArgumentException>(() => new Sampler(new("Upkeep", "elements[2].amount", low, likely, high, DistributionKind.Lognormal)));

    [Fact]
    public void Discrete_draws_take_only_their_values_at_their_probabilities()
    {
        // Each value's share of the draws is binomial about its probability (common practice, no source).
        DiscreteOutcome[] outcomes = [new(0, 0.2), new(20_000, 0.5), new(30_000, 0.3)];
        var draws = Draw(new("Resale", "elements[3].amount", 0, 20_000, 30_000, DistributionKind.Discrete, outcomes), seed: 17);
        Assert.All(draws, d => Assert.Contains(d, outcomes.Select(o => o.Value)));
        foreach (DiscreteOutcome o in outcomes)
        {
            double share = draws.Count(d => d == o.Value) / (double)Draws;
            Assert.InRange(share, o.Probability - 4 * Math.Sqrt(o.Probability * (1 - o.Probability) / Draws), o.Probability + 4 * Math.Sqrt(o.Probability * (1 - o.Probability) / Draws));
        }
    }
}
