using System.Text.Json.Serialization;
using CapReview.Engine.Evaluation;

namespace CapReview.Web.Api;

/// <summary>A taxed model's after-tax figures: the yearly table, the depreciation schedule and the after-tax measures.</summary>
/// <param name="IncomeTaxRate">The rate applied (combined, when a state rate was given).</param>
/// <param name="MarrBasis">Where the after-tax MARR comes from, in words.</param>
/// <param name="Flows">One row a year, 0 … horizon.</param>
/// <param name="Depreciation">The depreciation of the first cost by tax year.</param>
/// <param name="BookValueAtDisposal">Book value when the asset is sold at the horizon.</param>
/// <param name="GainOnDisposal">Proceeds less book value (negative: a loss).</param>
/// <param name="LossCarriedOut">Losses still unused at the end (carry-forward only).</param>
/// <param name="Measures">Every measure of the after-tax flows at the after-tax MARR.</param>
/// <param name="Equity">The same for the owners' flows with a loan; absent without one.</param>
public sealed record AfterTaxResponse(
    double IncomeTaxRate,
    string MarrBasis,
    IReadOnlyList<AfterTaxFlowResponse> Flows,
    DepreciationResponse Depreciation,
    double BookValueAtDisposal,
    double GainOnDisposal,
    double LossCarriedOut,
    EvaluationResponse Measures,
    [property: JsonIgnore(Condition = JsonIgnoreCondition.WhenWritingNull)] EvaluationResponse? Equity)
{
    public static AfterTaxResponse From(AfterTaxEvaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        var table = evaluation.Table;
        var schedule = evaluation.Settings.Depreciation;
        return new AfterTaxResponse(
            evaluation.Settings.IncomeTaxRate,
            evaluation.AfterTaxMarrBasis,
            [.. table.Rows.Select(r => new AfterTaxFlowResponse(r.Period, r.BeforeTax, r.Depreciation, r.TaxableIncome, r.LossUsed, r.Tax, r.Credit, r.AfterTax, r.Equity))],
            new DepreciationResponse(schedule.Method, schedule.Basis, schedule.Amounts, [.. Enumerable.Range(1, schedule.Amounts.Count).Select(schedule.BookValueAfter)]),
            table.BookValueAtDisposal,
            table.GainOnDisposal,
            table.LossCarriedOut,
            EvaluationResponse.From(evaluation.AfterTax),
            evaluation.Equity is { } equity ? EvaluationResponse.From(equity) : null);
    }
}
