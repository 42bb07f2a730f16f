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
}
