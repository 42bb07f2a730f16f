using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Tests.Support;

internal static class Models
{
    public static CashFlowModel Valid(int horizon, int periodsPerYear, params CashFlowElement[] elements)
    {
        var outcome = CashFlowModel.Create(horizon, periodsPerYear, elements);
        Assert.True(outcome.IsValid, string.Join("; ", outcome.Errors.Select(e => $"{e.Field}: {e.Message}")));
        return outcome.Value!;
    }

    public static double[] Flows(int horizon, params CashFlowElement[] elements) => [.. Valid(horizon, 1, elements).NetFlows];
}
