using MathNet.Numerics.Distributions;

namespace CapReview.Engine.Risk;

/// <summary>Draws values of one uncertain parameter from its distribution (MathNet.Numerics), with a given source of randomness.</summary>
internal sealed class Sampler
{
    // The standard normal's 95th percentile: low and high are the lognormal's 5th and 95th percentiles, and would be the
    // normal's were it not cut at them with the most likely value midway.
    private const double Z95 = 1.6448536269514722;
    private readonly UncertainParameter _p;

    public Sampler(UncertainParameter parameter)
    {
        _p = parameter;
        Check(parameter);
    }

    public double Draw(Random random) => _p.Distribution switch
    {
        DistributionKind.Uniform => ContinuousUniform.Sample(random, _p.Low, _p.High),
        DistributionKind.Triangular => _p.Low == _p.High ? _p.Low : Triangular.Sample(random, _p.Low, _p.High, _p.MostLikely),
        DistributionKind.Pert => _p.Low == _p.High ? _p.Low : _p.Low + (_p.High - _p.Low) * Beta.Sample(random,
            1 + 4 * (_p.MostLikely - _p.Low) / (_p.High - _p.Low), 1 + 4 * (_p.High - _p.MostLikely) / (_p.High - _p.Low)),
        DistributionKind.Normal => TruncatedNormal(random),
        DistributionKind.Lognormal => LogNormalDraw(random),
        _ => DiscreteDraw(random),
    };

    private double TruncatedNormal(Random random)
    {
        double sigma = (_p.High - _p.Low) / (2 * Z95);
        if (sigma == 0)
        {
            return _p.MostLikely;
        }
        for (int k = 0; k < 1000; k++)
        {
            double x = Normal.Sample(random, _p.MostLikely, sigma);
            if (x >= _p.Low && x <= _p.High)
            {
                return x;
            }
        }
        return _p.MostLikely;
    }

    private double LogNormalDraw(Random random)
    {
        // Costs are negative: the magnitudes are lognormal, the sign kept.
        double sign = _p.MostLikely < 0 ? -1 : 1;
        var (mu, sigma) = LognormalFit(_p.Low, _p.High);
        return sigma == 0 ? _p.Low : sign * LogNormal.Sample(random, mu, sigma);
    }

    /// <summary>
    /// μ and σ of ln|X| such that the smaller magnitude of low and high is the 5th percentile of |X| and the larger its
    /// 95th: ln a = μ − z σ and ln b = μ + z σ, z the standard normal's 95th percentile. Two percentiles fix a
    /// lognormal, so the most likely value does not enter: the median is √(a b) and the mode e^(μ − σ²).
    /// </summary>
    internal static (double Mu, double Sigma) LognormalFit(double low, double high)
    {
        double a = Math.Log(Math.Min(Math.Abs(low), Math.Abs(high))), b = Math.Log(Math.Max(Math.Abs(low), Math.Abs(high)));
        return (0.5 * (a + b), (b - a) / (2 * Z95));
    }

    private double DiscreteDraw(Random random)
    {
        double u = random.NextDouble(), cumulative = 0;
        foreach (DiscreteOutcome o in _p.Outcomes!)
        {
            cumulative += o.Probability;
            if (u < cumulative)
            {
                return o.Value;
            }
        }
        return _p.Outcomes![^1].Value;
    }

    private static void Check(UncertainParameter p)
    {
        if (p.Distribution == DistributionKind.Discrete)
        {
            if (p.Outcomes is not { Count: > 0 } outcomes || outcomes.Any(o => !double.IsFinite(o.Value) || !(o.Probability >= 0))
                || Math.Abs(outcomes.Sum(o => o.Probability) - 1) > 1e-9)
            {
                throw new ArgumentException($"{p.Name}: a discrete parameter needs values with probabilities that add up to 1.", nameof(p));
            }
            return;
        }
        if (!(p.Low <= p.MostLikely && p.MostLikely <= p.High) || !double.IsFinite(p.Low) || !double.IsFinite(p.High))
        {
            throw new ArgumentException($"{p.Name}: low ≤ most likely ≤ high, all finite.", nameof(p));
        }
        if (p.Distribution == DistributionKind.Lognormal && (p.Low * p.High <= 0 || p.MostLikely * p.Low <= 0))
        {
            throw new ArgumentException($"{p.Name}: a lognormal parameter's values must all have the same sign, none zero.", nameof(p));
        }
    }
}
