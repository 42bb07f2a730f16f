using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Taxes;

/// <summary>
/// The capital outlays after year 0, each depreciated as an asset of its own: the outlays of year t form an asset
/// placed in service in year t, whose first tax year's depreciation (under MACRS the convention's part-year) is
/// deducted in year t, and which is disposed of with the first cost at the horizon, its book value then recovered
/// against the salvage (IRS Publication 946, "Placed in service" and "Early dispositions"; common practice for the
/// book methods, no source). An outlay of the horizon year itself is placed in service and disposed of in the same
/// year: it takes no depreciation and its whole cost is book value (Publication 946, from memory). Outlays marked
/// <see cref="CashFlowElement.Expensed"/> (repairs) and receipts of the capital category stay deductions or income
/// of their year.
/// </summary>
/// <param name="Cost">The cost capitalised in each year, 0 to the horizon (positive), taken out of the year's deductions.</param>
/// <param name="Depreciation">The outlays' depreciation in each year, 0 to the horizon.</param>
/// <param name="BookValueAtDisposal">The outlays' book value left at the horizon.</param>
public sealed record OutlayAssets(IReadOnlyList<double> Cost, IReadOnlyList<double> Depreciation, double BookValueAtDisposal)
{
    /// <summary>The outlays of <paramref name="model"/> under <paramref name="rule"/>; with no rule, none is capitalised (each is deducted in its year).</summary>
    public static OutlayAssets Of(CashFlowModel model, OutlayDepreciation? rule)
    {
        ArgumentNullException.ThrowIfNull(model);
        int n = model.Horizon;
        var cost = new double[n + 1];
        var depreciation = new double[n + 1];
        if (rule is null)
        {
            return new(cost, depreciation, 0);
        }
        double bookValue = 0;
        // The outlays of one year and one class form one asset: those with the first cost's class (null) apart from
        // each class or life of their own.
        var classes = model.Elements.Where(IsCapitalised).Select(element => element.DepreciatedAs).Distinct();
        foreach (var depreciatedAs in classes)
        {
            var own = new double[n + 1];
            for (int e = 0; e < model.Elements.Count; e++)
            {
                if (IsCapitalised(model.Elements[e]) && Equals(model.Elements[e].DepreciatedAs, depreciatedAs))
                {
                    double[] flows = model.FlowsOf(e);
                    for (int t = 1; t <= n; t++)
                    {
                        own[t] += Math.Max(0, -flows[t]);
                    }
                }
            }
            bookValue += Depreciate(own, rule.For(depreciatedAs), depreciation);
            for (int t = 1; t <= n; t++)
            {
                cost[t] += own[t];
            }
        }
        return new(cost, depreciation, bookValue);
    }

    private static bool IsCapitalised(CashFlowElement element) => element is { Category: CashFlowCategory.Capital, Expensed: false };

    /// <summary>Adds the depreciation of the assets bought by <paramref name="cost"/> to <paramref name="depreciation"/>; returns their book value at the horizon.</summary>
    private static double Depreciate(double[] cost, OutlayDepreciation rule, double[] depreciation)
    {
        int n = cost.Length - 1;
        double bookValue = 0;
        for (int t = 1; t <= n; t++)
        {
            if (cost[t] == 0)
            {
                continue;
            }
            if (t == n)
            {
                bookValue += cost[t];
                continue;
            }
            // Tax year k of an asset placed in service in year t falls in year t + k − 1.
            int yearsHeld = n - t + 1;
            var schedule = rule.ScheduleFor(cost[t], t).DisposedIn(yearsHeld, rule.DisposalYearShare);
            for (int k = 0; k < Math.Min(yearsHeld, schedule.Amounts.Count); k++)
            {
                depreciation[t + k] += schedule.Amounts[k];
            }
            bookValue += schedule.BookValueAfter(yearsHeld);
        }
        return bookValue;
    }
}
