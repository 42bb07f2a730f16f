using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;

namespace CapReview.Web.QuickEvaluation;

/// <summary>
/// One row of the element grid as typed: numbers stay text until read, so that a half-typed value is kept and
/// named rather than silently replaced.
/// </summary>
public sealed class ElementDraft
{
    /// <summary>The row's key for rendering only: not part of the typed work a page keeps or compares.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public Guid Key { get; } = Guid.NewGuid();

    /// <summary>The element's stable identity, which risk parameters name; kept from the stored element, new for a new row.</summary>
    public string Id { get; init; } = Reviews.Proposals.ElementIdentities.NewId();

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

    /// <summary>For a capital cost after period 0: a repair deducted in its year rather than an asset depreciated from it.</summary>
    public bool Expensed { get; set; }

    /// <summary>For a capital cost after period 0 under MACRS: its own property class; null for the first cost's.</summary>
    public Engine.Depreciation.MacrsClass? OwnClass { get; set; }

    /// <summary>For a capital cost after period 0 under a book method: its own life in years as typed; blank for the first cost's.</summary>
    public string OwnLife { get; set; } = "";

    /// <summary>The row of a stored or imported element, its numbers written in <paramref name="culture"/> as a person would type them.</summary>
    public static ElementDraft FromSpec(ElementSpec e, System.Globalization.CultureInfo culture)
    {
        ArgumentNullException.ThrowIfNull(e);
        string Whole(int? value) => value?.ToString(culture) ?? "";
        return new ElementDraft
        {
            Id = e.Id ?? Reviews.Proposals.ElementIdentities.NewId(),
            Type = e.Type ?? ElementKind.Single,
            Label = e.Label ?? "",
            Category = e.Category ?? CashFlowCategory.Operating,
            Period = Whole(e.Period ?? 0),
            First = Whole(e.First ?? 1),
            Last = Whole(e.Last ?? 1),
            Every = Whole(e.Every ?? 1),
            Amount = Number(e.Amount ?? 0, culture),
            Step = Number(e.Step ?? 0, culture),
            GrowthPercent = Number((e.Growth ?? 0) * 100, culture),
            Money = e.Money ?? Engine.Inflation.MoneyBasis.Actual,
            EscalationPercent = e.Escalation is double escalation ? Number(escalation * 100, culture) : "",
            Expensed = e.Expensed == true,
            OwnClass = e.DepreciatedAs?.PropertyClass,
            OwnLife = Whole(e.DepreciatedAs?.Life),
        };
    }

    /// <summary>A number as typed: no thousands separators, up to twelve decimals, blank when absent.</summary>
    public static string Number(double? value, System.Globalization.CultureInfo culture) => value is double v ? v.ToString("0.############", culture) : "";

    /// <summary>Whether the row as typed may be marked as a repair (<see cref="ElementFields.MayBeExpensed"/>); a period not yet a number may not.</summary>
    public bool MayBeExpensed => int.TryParse(Type == ElementKind.Single ? Period : First, System.Globalization.NumberStyles.AllowLeadingSign, System.Globalization.CultureInfo.InvariantCulture, out int first) && ElementFields.MayBeExpensed(Category, first);

    public bool Uses(string field) => field == "escalation"
        ? Money == Engine.Inflation.MoneyBasis.Constant
        : ElementFields.Uses(Type, field);
}
