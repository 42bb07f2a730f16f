using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Web.Api;

/// <summary>A model and its risk settings, in the form of a proposal version's assumptions (<c>model</c>, <c>tax</c>, <c>risk</c>).</summary>
public sealed record RiskAnalysisRequest
{
    /// <summary>The model, with the MARR it is judged at, as <c>POST /api/v1/evaluations</c> takes it.</summary>
    public ModelSpec? Model { get; init; }

    /// <summary>After-tax settings; with them every figure is the after-tax one.</summary>
    public TaxSpec? Tax { get; init; }

    /// <summary>The uncertain parameters, correlations, named scenarios, trials and seed.</summary>
    public RiskSpec? Risk { get; init; }

    /// <summary>The figure the tornado and spider follow; default present worth.</summary>
    public RiskMeasure? Measure { get; init; }
}
