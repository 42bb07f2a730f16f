using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;

namespace CapReview.Web.Demo;

/// <summary>Short ways of writing the demo's yearly models.</summary>
internal static class DemoElements
{
    public static ModelSpec Model(int years, params ElementSpec[] elements) => new() { PeriodsPerYear = 1, Horizon = years, Elements = elements };

    public static ElementSpec Single(string label, CashFlowCategory category, int period, double amount) =>
        new() { Type = ElementKind.Single, Label = label, Category = category, Period = period, Amount = amount };

    public static ElementSpec Uniform(string label, CashFlowCategory category, int first, int last, double amount) =>
        new() { Type = ElementKind.Uniform, Label = label, Category = category, First = first, Last = last, Amount = amount };
}
