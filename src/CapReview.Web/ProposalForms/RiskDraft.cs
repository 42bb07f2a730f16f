using System.Globalization;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;
using CapReview.Reviews.Risk;

namespace CapReview.Web.ProposalForms;

/// <summary>One uncertain parameter as typed.</summary>
public sealed class ParameterDraft
{
    public string Name { get; set; } = "";

    public string Target { get; set; } = "";

    public string Low { get; set; } = "";

    public string MostLikely { get; set; } = "";

    public string High { get; set; } = "";

    public DistributionKind Distribution { get; set; } = DistributionKind.Triangular;

    /// <summary>For a discrete parameter: "value : probability" pairs separated by semicolons.</summary>
    public string Outcomes { get; set; } = "";

    /// <summary>Low, most likely and high from their stored values (rates as fractions), as a person types them.</summary>
    public void SetValues(double? low, double? mostLikely, double? high, CultureInfo culture)
    {
        string Typed(double? v) => v is double d ? Math.Round(RiskUnits.Entered(Target, d), 10).ToString("0.##########", culture) : "";
        (Low, MostLikely, High) = (Typed(low), Typed(mostLikely), Typed(high));
    }
}

/// <summary>A named scenario as typed: its name and a value for each parameter it sets (blank: most likely).</summary>
public sealed class ScenarioDraft
{
    public string Name { get; set; } = "";

    public Dictionary<string, string> Values { get; } = new(StringComparer.Ordinal);
}

/// <summary>A rank correlation between two parameters as typed.</summary>
public sealed class CorrelationDraft
{
    public string First { get; set; } = "";

    public string Second { get; set; } = "";

    public string Coefficient { get; set; } = "0.5";
}

/// <summary>
/// The risk analysis as a lead types it: the parameters, their correlations, the trials and the seed. Values of a
/// rate (the MARR, a growth, …) are typed in percent, as everywhere else on the page; <see cref="RiskUnits"/> says
/// which inputs are rates, and the stored form holds fractions.
/// </summary>
public sealed class RiskDraft
{
    public List<ParameterDraft> Parameters { get; } = [];

    public List<CorrelationDraft> Correlations { get; } = [];

    public List<ScenarioDraft> Scenarios { get; } = [];

    public string Trials { get; set; } = "10000";

    public string Seed { get; set; } = "2027";

    public static RiskDraft From(RiskSpec? spec, CultureInfo culture)
    {
        var draft = new RiskDraft();
        if (spec is null)
        {
            return draft;
        }
        string Number(double? v) => v?.ToString("0.############", culture) ?? "";
        draft.Parameters.AddRange((spec.Parameters ?? []).Where(p => p is not null).Select(p =>
        {
            var parameter = new ParameterDraft { Name = p!.Name ?? "", Target = p.Target ?? "", Distribution = p.Distribution ?? DistributionKind.Triangular };
            parameter.SetValues(p.Low, p.MostLikely, p.High, culture);
            parameter.Outcomes = string.Join("; ", (p.Outcomes ?? []).Select(o => $"{Number(RiskUnits.Entered(p.Target, o.Value))} : {Number(o.Probability)}"));
            return parameter;
        }));
        string TargetOf(string name) => spec.Parameters?.FirstOrDefault(p => p?.Name == name)?.Target ?? "";
        foreach (ScenarioSpec? scenario in spec.Scenarios ?? [])
        {
            if (scenario is null)
            {
                continue;
            }
            var s = new ScenarioDraft { Name = scenario.Name ?? "" };
            foreach (var (name, value) in scenario.Values ?? new Dictionary<string, double>())
            {
                s.Values[name] = Number(RiskUnits.Entered(TargetOf(name), value));
            }
            draft.Scenarios.Add(s);
        }
        draft.Correlations.AddRange((spec.Correlations ?? []).Select(c => new CorrelationDraft { First = c.First, Second = c.Second, Coefficient = c.Coefficient.ToString("0.############", culture) }));
        draft.Trials = (spec.Trials ?? MonteCarlo.DefaultTrials).ToString(culture);
        draft.Seed = (spec.Seed ?? 1).ToString(culture);
        return draft;
    }

    /// <summary>The names typed so far, whatever else fails to read: enough for a message to name its parameter or scenario.</summary>
    public RiskSpec Names() => new()
    {
        Parameters = [.. Parameters.Select(p => new ParameterSpec { Name = p.Name })],
        Scenarios = [.. Scenarios.Select(s => new ScenarioSpec { Name = s.Name })],
    };

    /// <summary>
    /// The stored form, null when nothing is set, with the fields that did not parse. Correlations or scenarios left
    /// without any parameter are refused rather than dropped: saving must not lose what the lead typed.
    /// </summary>
    public (RiskSpec? Spec, IReadOnlyList<InputError> Errors) Read(CultureInfo culture)
    {
        if (Parameters.Count == 0)
        {
            List<InputError> orphans = [.. Correlations.Select((_, k) => new InputError($"risk.correlations[{k}]", "a correlation joins two parameters: add them, or remove the correlation.")),
                .. Scenarios.Select((_, k) => new InputError($"risk.scenarios[{k}]", "a scenario sets parameters' values: add a parameter, or remove the scenario."))];
            return (null, orphans);
        }
        var errors = new List<InputError>();
        double? Number(string text, string field)
        {
            if (double.TryParse(text.Trim().Replace('−', '-'), NumberStyles.Float | NumberStyles.AllowThousands, culture, out double v) && double.IsFinite(v))
            {
                return v;
            }
            errors.Add(new(field, $"“{text.Trim()}” is not a number."));
            return null;
        }
        int? Whole(string text, string field)
        {
            if (int.TryParse(text.Trim(), NumberStyles.Integer | NumberStyles.AllowThousands, culture, out int v))
            {
                return v;
            }
            errors.Add(new(field, $"“{text.Trim()}” is not a whole number."));
            return null;
        }
        double? Value(string text, string field, string target) => Number(text, field) is double v ? RiskUnits.Stored(target, v) : null;
        string TargetOf(string name) => Parameters.FirstOrDefault(p => p.Name == name)?.Target ?? "";
        List<DiscreteOutcome> Outcomes(string text, string field, string target)
        {
            var outcomes = new List<DiscreteOutcome>();
            foreach (string pair in text.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
            {
                string[] parts = pair.Split(':', StringSplitOptions.TrimEntries);
                if (parts.Length != 2)
                {
                    errors.Add(new(field, $"“{pair}” is not value : probability."));
                    continue;
                }
                outcomes.Add(new DiscreteOutcome(Value(parts[0], field, target) ?? 0, Number(parts[1], field) ?? 0));
            }
            return outcomes;
        }
        var spec = new RiskSpec
        {
            Parameters = [.. Parameters.Select((p, k) => new ParameterSpec
            {
                Name = p.Name,
                Target = p.Target,
                Low = Value(p.Low, $"risk.parameters[{k}].low", p.Target),
                MostLikely = Value(p.MostLikely, $"risk.parameters[{k}].mostLikely", p.Target),
                High = Value(p.High, $"risk.parameters[{k}].high", p.Target),
                Distribution = p.Distribution,
                Outcomes = p.Distribution == DistributionKind.Discrete ? Outcomes(p.Outcomes, $"risk.parameters[{k}].outcomes", p.Target) : null,
            })],
            Scenarios = Scenarios.Count == 0 ? null : [.. Scenarios.Select((s, k) => new ScenarioSpec
            {
                Name = s.Name,
                Values = s.Values.Where(v => v.Value.Trim().Length > 0)
                    .ToDictionary(v => v.Key, v => Value(v.Value, $"risk.scenarios[{k}].values", TargetOf(v.Key)) ?? 0, StringComparer.Ordinal),
            })],
            Correlations = Correlations.Count == 0 ? null
                : [.. Correlations.Select((c, k) => new Correlation(c.First, c.Second, Number(c.Coefficient, $"risk.correlations[{k}].coefficient") ?? 0))],
            Trials = Whole(Trials, "risk.trials"),
            Seed = Whole(Seed, "risk.seed"),
        };
        return (spec, errors);
    }
}
