using CapReview.Engine.Risk;

namespace CapReview.Reviews.Risk;

/// <summary>The deterministic analyses of one set of risk settings: nothing in it is drawn at random.</summary>
/// <param name="Measure">The figure the tornado and spider follow.</param>
/// <param name="Basis">That figure with every parameter at its most likely value (the tornado's centre).</param>
/// <param name="Tornado">Each parameter at its low and high value, widest swing first.</param>
/// <param name="Spider">Each parameter's most likely value changed by −50 % … +50 %.</param>
/// <param name="BreakEvens">Each parameter's break-even value (present worth zero), in the parameters' order.</param>
/// <param name="Scenarios">Pessimistic, most likely, optimistic and the named scenarios, each with PW and AW.</param>
public sealed record SensitivityResult(
    RiskMeasure Measure,
    double Basis,
    IReadOnlyList<TornadoBar> Tornado,
    IReadOnlyList<SpiderLine> Spider,
    IReadOnlyList<BreakEvenValue> BreakEvens,
    IReadOnlyList<ScenarioResult> Scenarios);
