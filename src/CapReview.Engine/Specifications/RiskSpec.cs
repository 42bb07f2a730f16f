using CapReview.Engine.Risk;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Specifications;

/// <summary>The uncertain parameters of a proposal and its simulation settings, as entered and stored with a version.</summary>
public sealed record RiskSpec
{
    public IReadOnlyList<ParameterSpec?>? Parameters { get; init; }

    /// <summary>Trials of the simulation; default 10,000, at most 1,000,000.</summary>
    public int? Trials { get; init; }

    /// <summary>The seed the simulation's draws follow, recorded so its numbers can be made again.</summary>
    public int? Seed { get; init; }

    /// <summary>Rank correlations between parameters, by their names.</summary>
    public IReadOnlyList<Correlation>? Correlations { get; init; }

    /// <summary>The board's named scenarios: values for some parameters, by parameter name; the others at most likely.</summary>
    public IReadOnlyList<ScenarioSpec?>? Scenarios { get; init; }
}

/// <summary>A named scenario as entered.</summary>
public sealed record ScenarioSpec
{
    public string? Name { get; init; }

    /// <summary>Values by parameter name.</summary>
    public IReadOnlyDictionary<string, double>? Values { get; init; }
}

/// <summary>One uncertain parameter as entered.</summary>
public sealed record ParameterSpec
{
    public string? Name { get; init; }

    /// <summary>The input's field path, e.g. elements[1].amount, rate, horizon.</summary>
    public string? Target { get; init; }

    public double? Low { get; init; }

    public double? MostLikely { get; init; }

    public double? High { get; init; }

    public DistributionKind? Distribution { get; init; }

    public IReadOnlyList<DiscreteOutcome>? Outcomes { get; init; }
}

/// <summary>The parameters and simulation settings as read.</summary>
public sealed record RiskSettings(IReadOnlyList<UncertainParameter> Parameters, int Trials, int Seed, IReadOnlyList<Correlation> Correlations)
{
    /// <summary>The named scenarios with their values keyed by input, as <see cref="Risk.Scenarios"/> takes them.</summary>
    public IReadOnlyList<Scenario> Named { get; init; } = [];
}

/// <summary>Reads a <see cref="RiskSpec"/>, naming each bad field under "risk".</summary>
public static class RiskSpecReader
{
    /// <summary>The largest magnitude of a parameter's low, most likely or high value: the largest flow a model holds.</summary>
    public const double MaxValue = CashFlows.CashFlowElement.MaxFlow;

    public static Outcome<RiskSettings> Read(RiskSpec spec, ProposalCase proposal)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(proposal);
        var errors = new List<InputError>();
        var parameters = new List<UncertainParameter>();
        for (int k = 0; k < (spec.Parameters?.Count ?? 0); k++)
        {
            string path = $"risk.parameters[{k}]";
            ParameterSpec? p = spec.Parameters![k];
            if (p is null || string.IsNullOrWhiteSpace(p.Name))
            {
                errors.Add(new($"{path}.name", "Name the parameter."));
                continue;
            }
            if (p.Target is not null && ElementIdentity.Parse(p.Target) is var (id, _) && proposal.Resolve(p.Target) is null)
            {
                // Never retarget: the element it varied was deleted, so the parameter must be pointed again.
                errors.Add(new($"{path}.target", $"The element this parameter varies (id “{id}”) is no longer in the model: choose its input again."));
                continue;
            }
            if (p.Target is null || !proposal.CanVary(p.Target))
            {
                errors.Add(new($"{path}.target", "Choose an input of the model to vary."));
                continue;
            }
            if (p.Low is not double low || p.MostLikely is not double likely || p.High is not double high || !double.IsFinite(low) || !double.IsFinite(likely) || !double.IsFinite(high))
            {
                errors.Add(new($"{path}.low", "Give the low, most likely and high values."));
                continue;
            }
            if (Math.Abs(low) > MaxValue || Math.Abs(high) > MaxValue)
            {
                // Beyond the largest flow no input of a model means anything, and the break-even search, which looks
                // twice the range's width beyond each end, must stay among finite numbers.
                errors.Add(new(Math.Abs(low) > MaxValue ? $"{path}.low" : $"{path}.high", "Keep the values within ±10¹⁵, the largest flow a model holds."));
                continue;
            }
            if (!(low <= likely && likely <= high))
            {
                errors.Add(new($"{path}.mostLikely", "The values must run low ≤ most likely ≤ high."));
                continue;
            }
            var parameter = new UncertainParameter(p.Name.Trim(), p.Target, low, likely, high, p.Distribution ?? DistributionKind.Triangular, p.Outcomes);
            try
            {
                _ = new Sampler(parameter);
                parameters.Add(parameter);
            }
            catch (ArgumentException ex)
            {
                errors.Add(new($"{path}.distribution", ex.Message.Split(" (Parameter", 2)[0]));
            }
        }
        int trials = spec.Trials ?? MonteCarlo.DefaultTrials;
        if (trials is < 1 or > MonteCarlo.MaxTrials)
        {
            errors.Add(new("risk.trials", "Run 1 to 1,000,000 trials."));
        }
        var correlations = spec.Correlations ?? [];
        if (errors.Count == 0 && correlations.Count > 0)
        {
            try
            {
                _ = RankCorrelation.Of(parameters, correlations);
            }
            catch (ArgumentException ex)
            {
                errors.Add(new("risk.correlations", ex.Message.Split(" (Parameter", 2)[0]));
            }
        }
        var named = new List<Scenario>();
        for (int k = 0; k < (spec.Scenarios?.Count ?? 0); k++)
        {
            ScenarioSpec? scenario = spec.Scenarios![k];
            if (scenario is null || string.IsNullOrWhiteSpace(scenario.Name))
            {
                errors.Add(new($"risk.scenarios[{k}].name", "Name the scenario."));
                continue;
            }
            var values = new Dictionary<string, double>(StringComparer.Ordinal);
            foreach (var (name, value) in scenario.Values ?? new Dictionary<string, double>())
            {
                UncertainParameter? parameter = parameters.FirstOrDefault(p => p.Name == name);
                if (parameter is null || !double.IsFinite(value))
                {
                    errors.Add(new($"risk.scenarios[{k}].values", $"{name} is not a parameter with a number to set."));
                    continue;
                }
                values[parameter.Target] = value;
            }
            named.Add(new Scenario(scenario.Name.Trim(), values));
        }
        return errors.Count > 0 ? Outcome.Failure<RiskSettings>(errors) : Outcome.Success(new RiskSettings(parameters, trials, spec.Seed ?? 1, correlations) { Named = named });
    }
}
