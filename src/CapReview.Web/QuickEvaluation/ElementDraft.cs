using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;

namespace CapReview.Web.QuickEvaluation;

/// <summary>
/// One row of the element grid as typed: numbers stay text until read, so that a half-typed value is kept and
/// named rather than silently replaced.
/// </summary>
public sealed class ElementDraft
{
    public Guid Key { get; } = Guid.NewGuid();

    public ElementKind Type { get; set; } = ElementKind.Uniform;

    public string Label { get; set; } = "";

    public CashFlowCategory Category { get; set; } = CashFlowCategory.Operating;

    public string Period { get; set; } = "0";

    public string First { get; set; } = "1";

    public string Last { get; set; } = "1";

    public string Every { get; set; } = "1";

    public string Amount { get; set; } = "0";

    public string Step { get; set; } = "0";

    /// <summary>Growth per period in percent.</summary>
    public string GrowthPercent { get; set; } = "0";

    /// <summary>The money the amounts are in: actual, or constant money of the base year.</summary>
    public Engine.Inflation.MoneyBasis Money { get; set; } = Engine.Inflation.MoneyBasis.Actual;

    /// <summary>For constant money, the element's own escalation in percent a year; blank for general inflation.</summary>
    public string EscalationPercent { get; set; } = "";

    public bool Uses(string field) => field switch
    {
        "period" => Type == ElementKind.Single,
        "first" or "last" => Type != ElementKind.Single,
        "every" => Type == ElementKind.Recurring,
        "step" => Type == ElementKind.Arithmetic,
        "growth" => Type == ElementKind.Geometric,
        "escalation" => Money == Engine.Inflation.MoneyBasis.Constant,
        _ => true,
    };
}
