using CapReview.Reviews.Risk;

namespace CapReview.Web.Api;

/// <summary>A model's risk figures: the deterministic analyses and the seeded simulation's summary of present worth.</summary>
/// <param name="AfterTax">True when the figures are after tax.</param>
/// <param name="Measure">The figure the tornado and spider follow.</param>
/// <param name="Basis">That figure with every parameter at its most likely value.</param>
/// <param name="Tornado">Each parameter at its low and high value, widest swing first.</param>
/// <param name="Spider">Each parameter's most likely value changed by −50 % … +50 %.</param>
/// <param name="BreakEven">Each parameter's value at which present worth is zero (null when none nearby).</param>
/// <param name="Scenarios">Pessimistic, most likely, optimistic and the named scenarios.</param>
/// <param name="Simulation">The Monte Carlo summary, reproducible from its seed and trials.</param>
/// <param name="DiffersFromModel">The parameters whose most likely value is not their input's value in the model.</param>
public sealed record RiskAnalysisResponse(
    bool AfterTax,
    string Measure,
    double? Basis,
    IReadOnlyList<TornadoBarResponse> Tornado,
    IReadOnlyList<SpiderLineResponse> Spider,
    IReadOnlyList<BreakEvenResponse> BreakEven,
    IReadOnlyList<ScenarioResponse> Scenarios,
    SimulationResponse Simulation,
    IReadOnlyList<ParameterDriftResponse> DiffersFromModel)
{
    public static RiskAnalysisResponse From(RiskStudy study, SensitivityResult sensitivity, SimulationSummary simulation)
    {
        ArgumentNullException.ThrowIfNull(study);
        ArgumentNullException.ThrowIfNull(sensitivity);
        ArgumentNullException.ThrowIfNull(simulation);
        return new RiskAnalysisResponse(
            study.AfterTax,
            sensitivity.Measure == Engine.Risk.RiskMeasure.AnnualWorth ? "annualWorth" : "presentWorth",
            Finite(sensitivity.Basis),
            [.. sensitivity.Tornado.Select(b => new TornadoBarResponse(b.Parameter.Name, b.Parameter.Target, Finite(b.AtLow), Finite(b.AtHigh), Finite(b.Swing)))],
            [.. sensitivity.Spider.Select(l => new SpiderLineResponse(l.Parameter.Name, [.. l.Points.Select(p => p.Change)], [.. l.Points.Select(p => Finite(p.Measure))]))],
            [.. sensitivity.BreakEvens.Select(b => new BreakEvenResponse(b.Parameter.Name, b.Parameter.Target, b.Value is double v ? Finite(v) : null))],
            [.. sensitivity.Scenarios.Select(s => new ScenarioResponse(s.Name, Finite(s.PresentWorth), Finite(s.AnnualWorth)))],
            SimulationResponse.From(simulation),
            [.. study.Drifts.Select(d => new ParameterDriftResponse(d.Parameter.Name, d.Parameter.Target, d.Parameter.MostLikely, d.Current, d.Difference))]);
    }

    /// <summary>A figure as JSON can carry it: null where a move of the inputs made no valid model (NaN or infinite).</summary>
    internal static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
