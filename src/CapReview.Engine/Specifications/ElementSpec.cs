using CapReview.Engine.CashFlows;

namespace CapReview.Engine.Specifications;

/// <summary>
/// A cash-flow element as entered or stored: every field optional, so that a missing one can be named rather than
/// defaulted. Which fields an element needs depends on its <see cref="Type"/>.
/// </summary>
public sealed record ElementSpec
{
    /// <summary>
    /// The element's stable identity, which risk parameters name (<c>elements[#id].amount</c>) so that reordering,
    /// inserting or deleting elements cannot point a parameter at another element; null in documents stored before
    /// identities (their parameters name positions).
    /// </summary>
    public string? Id { get; init; }

    public ElementKind? Type { get; init; }

    public string? Label { get; init; }

    public CashFlowCategory? Category { get; init; }

    /// <summary>The period of a single amount.</summary>
    public int? Period { get; init; }

    /// <summary>The first period of a series.</summary>
    public int? First { get; init; }

    /// <summary>The last period of a series.</summary>
    public int? Last { get; init; }

    /// <summary>The interval of a recurring amount, in periods.</summary>
    public int? Every { get; init; }

    /// <summary>The flow at <see cref="Period"/> or at <see cref="First"/>: positive received, negative paid.</summary>
    public double? Amount { get; init; }

    /// <summary>The change per period of an arithmetic gradient.</summary>
    public double? Step { get; init; }

    /// <summary>The growth per period of a geometric gradient, as a fraction.</summary>
    public double? Growth { get; init; }

    /// <summary>The money the amounts are in; null for actual (then-current) money.</summary>
    public Inflation.MoneyBasis? Money { get; init; }

    /// <summary>For constant money: the element's own price escalation a year; null for general inflation.</summary>
    public double? Escalation { get; init; }

    /// <summary>
    /// True when a capital outlay after period 0 is a repair deducted in its year rather than an asset depreciated
    /// from its year; null otherwise. False is stored as null, so documents written before the flag keep their text
    /// and their hash.
    /// </summary>
    public bool? Expensed
    {
        get => expensed;
        init => expensed = value is true ? true : null;
    }

    /// <summary>
    /// For a capital outlay after period 0: its own MACRS class or life, when it is not depreciated as the first cost
    /// is; null for the first cost's. An empty choice is stored as null, so documents written before it keep their
    /// text and their hash.
    /// </summary>
    public Depreciation.OutlayClass? DepreciatedAs
    {
        get => depreciatedAs;
        init => depreciatedAs = value is not null && !value.IsEmpty() ? value : null;
    }

    private readonly bool? expensed;

    private readonly Depreciation.OutlayClass? depreciatedAs;
}
