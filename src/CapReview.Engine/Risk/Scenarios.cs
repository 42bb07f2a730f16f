namespace CapReview.Engine.Risk;

/// <summary>A named set of values for some of the parameters (e.g. "energy prices fall").</summary>
public sealed record Scenario(string Name, IReadOnlyDictionary<string, double> Values);

/// <summary>A scenario's measure.</summary>
public sealed record ScenarioResult(string Name, double PresentWorth, double AnnualWorth);

/// <summary>
/// Scenarios: the pessimistic set (every parameter at the end that gives the lower worth), the most likely, the
/// optimistic (the higher end), and any named by the board, with parameters it does not name at most likely.
/// </summary>
public static class Scenarios
{
    public static IReadOnlyList<ScenarioResult> Evaluate(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters, IReadOnlyList<Scenario>? named = null)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        ProposalCase basis = Sensitivity.MostLikely(proposal, parameters);
        var bars = Sensitivity.Tornado(proposal, parameters, RiskMeasure.PresentWorth);
        ProposalCase pessimistic = bars.Aggregate(basis, (c, b) => c.With(b.Parameter.Target, b.AtLow <= b.AtHigh ? b.Parameter.Low : b.Parameter.High));
        ProposalCase optimistic = bars.Aggregate(basis, (c, b) => c.With(b.Parameter.Target, b.AtLow <= b.AtHigh ? b.Parameter.High : b.Parameter.Low));
        var results = new List<ScenarioResult> { Result("Pessimistic", pessimistic), Result("Most likely", basis), Result("Optimistic", optimistic) };
        foreach (Scenario s in named ?? [])
        {
            results.Add(Result(s.Name, s.Values.Aggregate(basis, (c, v) => c.With(v.Key, v.Value))));
        }
        return results;
    }

    private static ScenarioResult Result(string name, ProposalCase c) =>
        new(name, c.Measure(RiskMeasure.PresentWorth), c.Measure(RiskMeasure.AnnualWorth));
}
