using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Comparison;

/// <summary>One of a group of mutually exclusive proposals, by name, with its validated model.</summary>
/// <param name="Name">The proposal's reference.</param>
/// <param name="Model">The validated cash-flow model; its horizon is the life.</param>
/// <param name="ValueAtStudyEnd">Its stated value where a study period cuts its life (as the ranking takes it; none is zero).</param>
public sealed record Alternative(string Name, CashFlowModel Model, double? ValueAtStudyEnd = null)
{
    /// <summary>The outlay at period 0 (positive), the order of the incremental analysis.</summary>
    public double FirstCost => Math.Max(0.0, -Model.NetFlows[0]);
}
