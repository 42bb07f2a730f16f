using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Taxes;

/// <summary>What the later-outlay tests share: straight-line tax settings and an evaluation that must be valid.</summary>
internal static class OutlayCases
{
    public static readonly TaxSpec StraightLine = new()
    {
        IncomeTaxRate = 0.25,
        Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 5, Salvage = 10_000 },
    };

    public static AfterTaxEvaluation Evaluate(ModelSpec model, TaxSpec tax)
    {
        var outcome = AfterTaxEvaluator.Evaluate(model, tax);
        Assert.True(outcome.IsValid, string.Join("; ", outcome.Errors.Select(e => e.Field + ": " + e.Message)));
        return outcome.Value!;
    }
}
