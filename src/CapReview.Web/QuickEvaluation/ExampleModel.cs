using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;

namespace CapReview.Web.QuickEvaluation;

/// <summary>
/// The demo scenario the page opens with: Tarnby Components Ltd (an invented company) recovering the waste heat of the
/// compressors in its machining hall. All figures are invented.
/// </summary>
public static class ExampleModel
{
    public static ModelDraft HeatRecoveryRetrofit()
    {
        var draft = new ModelDraft { Horizon = "12", PeriodsPerYear = 1, MarrPercent = "9" };
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Single, Label = "Heat exchangers and ducting", Category = CashFlowCategory.Capital, Period = "0", Amount = "-185000" });
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Geometric, Label = "Gas no longer bought for space heating", Category = CashFlowCategory.Revenue, First = "1", Last = "12", Amount = "42000", GrowthPercent = "3" });
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Arithmetic, Label = "Filter changes and inspections", Category = CashFlowCategory.Operating, First = "1", Last = "12", Amount = "-3500", Step = "-250" });
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Recurring, Label = "Exchanger overhaul", Category = CashFlowCategory.Capital, First = "4", Last = "11", Every = "4", Amount = "-18000" });
        draft.Elements.Add(new ElementDraft { Type = ElementKind.Single, Label = "Resale of the exchangers", Category = CashFlowCategory.Salvage, Period = "12", Amount = "15000" });
        return draft;
    }
}
