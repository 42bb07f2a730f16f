namespace CapReview.Engine.Specifications;

/// <summary>Which of an element's fields (by their names in the specification) each shape of element takes.</summary>
public static class ElementFields
{
    public static bool Uses(ElementKind kind, string field) => field switch
    {
        "period" => kind == ElementKind.Single,
        "first" or "last" => kind != ElementKind.Single,
        "every" => kind == ElementKind.Recurring,
        "step" => kind == ElementKind.Arithmetic,
        "growth" => kind == ElementKind.Geometric,
        _ => true,
    };

    /// <summary>
    /// Whether an element may be marked as a repair deducted in its year: only a capital cost after period 0 (an
    /// overhaul or addition); the first cost is always the depreciated asset, and other categories are never capitalised.
    /// </summary>
    public static bool MayBeExpensed(CashFlows.CashFlowCategory? category, int firstPeriod) =>
        category == CashFlows.CashFlowCategory.Capital && firstPeriod >= 1;
}
