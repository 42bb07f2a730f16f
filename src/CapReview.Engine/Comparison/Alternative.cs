using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Comparison;

/// <summary>One of a group of mutually exclusive proposals, by name, with its validated model.</summary>
public sealed record Alternative(string Name, CashFlowModel Model)
{
    /// <summary>The outlay at period 0 (positive), the order of the incremental analysis.</summary>
    public double FirstCost => Math.Max(0.0, -Model.NetFlows[0]);
}
