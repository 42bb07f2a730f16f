namespace CapReview.Engine.Risk;

/// <summary>One bar of the tornado: the measure with the parameter at its low and at its high value, the others at most likely.</summary>
public sealed record TornadoBar(UncertainParameter Parameter, double AtLow, double AtHigh)
{
    /// <summary>How far the measure moves between the two ends.</summary>
    public double Swing => Math.Abs(AtHigh - AtLow);
}

/// <summary>One line of the spider: the measure as the parameter moves by each percent of its most likely value.</summary>
public sealed record SpiderLine(UncertainParameter Parameter, IReadOnlyList<(double Change, double Measure)> Points);

/// <summary>
/// One-at-a-time sensitivity (common practice, no source): every parameter moved while the others stay at their most
/// likely values. The base case is the proposal with every parameter at its most likely value.
/// </summary>
public static class Sensitivity
{
    /// <summary>The base case: every parameter at its most likely value.</summary>
    public static ProposalCase MostLikely(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(parameters);
        return parameters.Aggregate(proposal, (c, p) => c.With(p.Target, p.MostLikely));
    }

    /// <summary>The tornado, widest swing first.</summary>
    public static IReadOnlyList<TornadoBar> Tornado(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters, RiskMeasure measure)
    {
        ProposalCase basis = MostLikely(proposal, parameters);
        return [.. parameters
            .Select(p => new TornadoBar(p, basis.With(p.Target, p.Low).Measure(measure), basis.With(p.Target, p.High).Measure(measure)))
            .OrderByDescending(b => double.IsNaN(b.Swing) ? double.NegativeInfinity : b.Swing)
            .ThenBy(b => b.Parameter.Name, StringComparer.Ordinal)];
    }

    /// <summary>The spider: each parameter at its most likely value changed by each of <paramref name="changes"/> (fractions, e.g. −0.5 … 0.5).</summary>
    public static IReadOnlyList<SpiderLine> Spider(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters, RiskMeasure measure, IReadOnlyList<double> changes)
    {
        ArgumentNullException.ThrowIfNull(changes);
        ProposalCase basis = MostLikely(proposal, parameters);
        return [.. parameters.Select(p => new SpiderLine(p, [.. changes.Select(c => (c, basis.With(p.Target, p.MostLikely * (1 + c)).Measure(measure)))]))];
    }

    /// <summary>The changes of the spider plot: −50 % to +50 % in steps of 10 %.</summary>
    public static IReadOnlyList<double> SpiderChanges { get; } = [.. Enumerable.Range(-5, 11).Select(k => k / 10.0)];
}
