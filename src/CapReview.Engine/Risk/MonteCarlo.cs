using MathNet.Numerics.Statistics;

namespace CapReview.Engine.Risk;

/// <summary>Mean, standard deviation and percentiles of one simulated figure.</summary>
public sealed record Summary(double Mean, double StandardDeviation, double P5, double P50, double P95, int Count)
{
    internal static Summary Of(double[] values)
    {
        var finite = values.Where(double.IsFinite).ToArray();
        if (finite.Length == 0)
        {
            return new Summary(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, 0);
        }
        Array.Sort(finite);
        return new Summary(finite.Mean(), finite.Length > 1 ? finite.StandardDeviation() : 0,
            SortedArrayStatistics.Quantile(finite, 0.05), SortedArrayStatistics.Quantile(finite, 0.50), SortedArrayStatistics.Quantile(finite, 0.95), finite.Length);
    }
}

/// <summary>One bar of a histogram: its range and how many trials fell in it.</summary>
public sealed record HistogramBin(double From, double To, int Count);

/// <summary>A simulation's figures, reproducible from its seed and trial count.</summary>
/// <param name="Trials">Trials run.</param>
/// <param name="Seed">The seed every draw followed.</param>
/// <param name="PresentWorth">PW over the trials.</param>
/// <param name="AnnualWorth">AW over the trials.</param>
/// <param name="RateOfReturn">The rate of return over the trials that have a unique one (its count says how many).</param>
/// <param name="ProbabilityOfLoss">The share of trials with PW below zero.</param>
/// <param name="Histogram">PW in 40 bins.</param>
/// <param name="Cumulative">PW at each percent of the trials, 0 … 100: the cumulative distribution.</param>
/// <param name="Invalid">Trials whose inputs made no valid model (e.g. a life below an element's last period).</param>
public sealed record MonteCarloResult(int Trials, int Seed, Summary PresentWorth, Summary AnnualWorth, Summary RateOfReturn,
    double ProbabilityOfLoss, IReadOnlyList<HistogramBin> Histogram, IReadOnlyList<double> Cumulative, int Invalid);

/// <summary>
/// Monte Carlo simulation of a proposal: each trial draws every parameter from its distribution and evaluates the
/// proposal. Trials are split into fixed blocks, each with its own generator seeded from the run's seed and the
/// block's number, so a run gives the same numbers whatever the number of cores; blocks run in parallel, report
/// progress and stop when cancelled.
/// </summary>
public static class MonteCarlo
{
    public const int DefaultTrials = 10_000;
    public const int MaxTrials = 1_000_000;
    private const int Block = 1_024;

    public static MonteCarloResult Run(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters, int trials, int seed,
        IReadOnlyList<Correlation>? correlations = null, IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        var (pw, aw, ror) = Simulate(proposal, parameters, trials, seed, correlations, progress, cancellationToken);
        return Summarise(pw, aw, ror, seed);
    }

    /// <summary>Each trial's PW, AW and unique rate of return (NaN where none or where the inputs make no valid model), in trial order.</summary>
    public static (double[] PresentWorth, double[] AnnualWorth, double[] RateOfReturn) Simulate(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters,
        int trials, int seed, IReadOnlyList<Correlation>? correlations = null, IProgress<double>? progress = null, CancellationToken cancellationToken = default) =>
        Simulate(proposal, parameters, trials, seed, correlations, progress, trialDone: null, cancellationToken);

    /// <summary>
    /// The simulation, with <paramref name="trialDone"/> called after each trial (for the tests that watch a
    /// cancellation stop the trials, not only the blocks). Cancellation is checked before every trial: a block of
    /// full evaluations of a long model takes long enough that waiting for its end would keep a closed page's run going.
    /// </summary>
    internal static (double[] PresentWorth, double[] AnnualWorth, double[] RateOfReturn) Simulate(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters,
        int trials, int seed, IReadOnlyList<Correlation>? correlations, IProgress<double>? progress, Action<int>? trialDone, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(parameters);
        if (trials is < 1 or > MaxTrials)
        {
            throw new ArgumentOutOfRangeException(nameof(trials), trials, "Run 1 to 1,000,000 trials.");
        }
        var samplers = parameters.Select(p => new Sampler(p)).ToArray();
        RankCorrelation? correlation = RankCorrelation.Of(parameters, correlations);
        var pw = new double[trials];
        var aw = new double[trials];
        var ror = new double[trials];
        int blocks = (trials + Block - 1) / Block, done = 0;
        CompiledTrials? compiled = CompiledTrials.TryCompile(proposal, parameters);
        Parallel.For(0, blocks, new ParallelOptions { CancellationToken = cancellationToken, MaxDegreeOfParallelism = Environment.ProcessorCount }, block =>
        {
            var random = new Random(BlockSeed(seed, block));
            int start = block * Block, end = Math.Min(trials, start + Block), rows = end - start;
            // A block's draws, parameter by parameter, then paired as the correlations ask.
            var draws = new double[samplers.Length][];
            for (int k = 0; k < samplers.Length; k++)
            {
                draws[k] = new double[rows];
                for (int r = 0; r < rows; r++)
                {
                    draws[k][r] = samplers[k].Draw(random);
                }
            }
            correlation?.Apply(draws, rows, random);
            var values = new double[samplers.Length];
            CompiledTrials.Workspace? space = compiled?.NewWorkspace();
            for (int r = 0; r < rows; r++)
            {
                cancellationToken.ThrowIfCancellationRequested();
                for (int k = 0; k < samplers.Length; k++)
                {
                    values[k] = draws[k][r];
                }
                int t = start + r;
                (pw[t], aw[t], ror[t]) = compiled is not null ? compiled.Run(values, space!) : Full(proposal, parameters, values);
                trialDone?.Invoke(t);
            }
            progress?.Report((double)Interlocked.Increment(ref done) / blocks);
        });
        return (pw, aw, ror);
    }

    /// <summary>One trial through the entered specification: for parameters the fast path cannot set (the life, inflation, tax).</summary>
    internal static (double, double, double) Full(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters, ReadOnlySpan<double> values)
    {
        ProposalCase trial = proposal;
        for (int k = 0; k < parameters.Count; k++)
        {
            trial = trial.With(parameters[k].Target, values[k]);
        }
        return trial.Evaluate().Value is { } e ? (e.PresentWorth, e.AnnualWorth, e.UniqueRateOfReturn ?? double.NaN) : (double.NaN, double.NaN, double.NaN);
    }

    /// <summary>A block's seed from the run's seed and the block's number (SplitMix64's mix: fixed, unlike HashCode, across processes).</summary>
    private static int BlockSeed(int seed, int block)
    {
        ulong z = ((ulong)(uint)seed << 32) | (uint)block;
        z += 0x9E3779B97F4A7C15;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EB;
        z ^= z >> 31;
        return (int)(z & 0x7FFFFFFF);
    }

    private static MonteCarloResult Summarise(double[] pw, double[] aw, double[] ror, int seed)
    {
        var finite = pw.Where(double.IsFinite).ToArray();
        Array.Sort(finite);
        var histogram = new List<HistogramBin>();
        var cumulative = new List<double>();
        if (finite.Length > 0)
        {
            double low = finite[0], high = finite[^1], width = high > low ? (high - low) / 40 : 1;
            var counts = new int[40];
            foreach (double v in finite)
            {
                counts[Math.Min(39, (int)((v - low) / width))]++;
            }
            histogram.AddRange(counts.Select((c, k) => new HistogramBin(low + k * width, low + (k + 1) * width, c)));
            cumulative.AddRange(Enumerable.Range(0, 101).Select(p => SortedArrayStatistics.Quantile(finite, p / 100.0)));
        }
        double loss = finite.Length == 0 ? double.NaN : finite.Count(v => v < 0) / (double)finite.Length;
        return new MonteCarloResult(pw.Length, seed, Summary.Of(pw), Summary.Of(aw), Summary.Of(ror), loss, histogram, cumulative, pw.Length - finite.Length);
    }
}
