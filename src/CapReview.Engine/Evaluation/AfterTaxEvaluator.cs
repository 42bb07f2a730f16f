using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Engine.Taxes;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Evaluation;

/// <summary>The before-tax measures, the after-tax table and the after-tax measures (and the equity's, with a loan).</summary>
/// <param name="BeforeTax">Every measure of the before-tax flows at the before-tax MARR.</param>
/// <param name="Table">The after-tax cash-flow table.</param>
/// <param name="AfterTax">Every measure of the after-tax flows at the after-tax MARR.</param>
/// <param name="Equity">The same for the owners' flows when part of the first cost is borrowed; null otherwise.</param>
/// <param name="Settings">The tax settings as read.</param>
/// <param name="AfterTaxMarrBasis">Where the after-tax MARR comes from, in words.</param>
public sealed record AfterTaxEvaluation(Evaluation BeforeTax, AfterTaxResult Table, Evaluation AfterTax, Evaluation? Equity, TaxSettings Settings, string AfterTaxMarrBasis);

/// <summary>Evaluates a model before and after tax; every bad field of either is named.</summary>
public static class AfterTaxEvaluator
{
    public static Outcome<AfterTaxEvaluation> Evaluate(ModelSpec model, TaxSpec tax)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(tax);
        var read = SpecificationReader.Read(model);
        if (!read.IsValid)
        {
            return Outcome.Failure<AfterTaxEvaluation>(read.Errors);
        }
        var (cashFlows, options) = read.Value!;
        var settings = TaxSpecReader.Read(tax, cashFlows);
        AnnualRate? afterTaxMarr = null;
        var errors = new List<InputError>(settings.Errors);
        string basis;
        if (tax.AfterTaxMarr is { } entered)
        {
            var rate = SpecificationReader.Read(model with { Rate = entered });
            errors.AddRange(rate.Errors.Where(e => e.Field.StartsWith("rate", StringComparison.Ordinal)).Select(e => e with { Field = "tax.afterTaxMarr" + e.Field["rate".Length..] }));
            afterTaxMarr = rate.Value?.Options.Marr;
            basis = "the after-tax MARR entered";
        }
        else
        {
            basis = "the before-tax MARR times (1 − the tax rate)";
        }
        if (errors.Count > 0)
        {
            return Outcome.Failure<AfterTaxEvaluation>(errors);
        }
        TaxSettings s = settings.Value!;
        // Without a stated after-tax MARR the common approximation: the before-tax MARR less its tax (no source).
        afterTaxMarr ??= AnnualRate.Effective(options.Marr.EffectiveAnnual() * (1 - s.IncomeTaxRate));
        var table = AfterTaxAnalysis.Compute(cashFlows, s);
        // Each set of flows may be past every double at its MARR (a loan or a tax that swells the flows at a rate near
        // the bound): then the field that set the MARR is named, as for the model's own.
        var before = ModelEvaluator.TryEvaluate(cashFlows, options);
        var after = ModelEvaluator.TryEvaluate(FlowsModel(table.AfterTaxFlows), new EvaluationOptions(afterTaxMarr.Value));
        var equity = s.Financing is null ? null : ModelEvaluator.TryEvaluate(FlowsModel(table.EquityFlows), new EvaluationOptions(afterTaxMarr.Value));
        errors.AddRange(before.Errors);
        string marrField = tax.AfterTaxMarr is null ? "tax.incomeTaxRate" : "tax.afterTaxMarr.value";
        errors.AddRange(after.Errors.Concat(equity?.Errors ?? []).Select(e => e with { Field = marrField }).Take(1));
        if (errors.Count > 0)
        {
            return Outcome.Failure<AfterTaxEvaluation>(errors);
        }
        return Outcome.Success(new AfterTaxEvaluation(before.Value!, table, after.Value!, equity?.Value, s, basis));
    }

    /// <summary>Yearly flows as a model: the outlay now as capital, later receipts as revenue, later payments as operating.</summary>
    private static CashFlowModel FlowsModel(IReadOnlyList<double> flows)
    {
        var elements = flows.Select((f, t) => new SingleAmount(t == 0 ? "Now" : $"Year {t}",
            t == 0 && f < 0 ? CashFlowCategory.Capital : f >= 0 ? CashFlowCategory.Revenue : CashFlowCategory.Operating, t, f)).ToList();
        return CashFlowModel.OfComputedFlows(flows.Count - 1, 1, elements);
    }
}
