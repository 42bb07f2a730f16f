using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;

namespace CapReview.Engine.Evaluation;

/// <summary>
/// An evaluation laid out period by period and element by element, as the record of a decision and the exports state
/// it: the same figures wherever they are shown.
/// </summary>
public static class PeriodTable
{
    /// <summary>The categories in the order tables show them.</summary>
    public static IReadOnlyList<CashFlowCategory> Categories { get; } =
        [CashFlowCategory.Capital, CashFlowCategory.Operating, CashFlowCategory.Revenue, CashFlowCategory.Salvage];

    /// <summary>Periods 0 … n: each category's flow, the net flow, (P/F, i, t) = (1 + i)^−t at the MARR per period, and the present worths.</summary>
    public static IReadOnlyList<PeriodRow> Of(Evaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        CashFlowModel model = evaluation.Model;
        var byCategory = Categories.ToDictionary(c => c, _ => new double[model.Horizon + 1]);
        for (int k = 0; k < model.Elements.Count; k++)
        {
            double[] flows = model.FlowsOf(k);
            double[] target = byCategory[model.Elements[k].Category];
            for (int t = 0; t < flows.Length; t++)
            {
                target[t] += flows[t];
            }
        }
        var rows = new List<PeriodRow>(model.Horizon + 1);
        double cumulative = 0;
        for (int t = 0; t <= model.Horizon; t++)
        {
            double factor = CompoundInterest.SinglePaymentPresentWorth(evaluation.MarrPerPeriod, t);
            double worth = model.NetFlows[t] * factor;
            cumulative += worth;
            rows.Add(new PeriodRow(t, Categories.ToDictionary(c => c, c => byCategory[c][t]), model.NetFlows[t], factor, worth, cumulative));
        }
        return rows;
    }

    /// <summary>Each element's present worth at the MARR per period, in the model's order; they add up to the model's.</summary>
    public static IReadOnlyList<double> ElementWorths(Evaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        return [.. Enumerable.Range(0, evaluation.Model.Elements.Count).Select(k => FlowWorth.PresentWorth(evaluation.Model.FlowsOf(k), evaluation.MarrPerPeriod))];
    }
}
