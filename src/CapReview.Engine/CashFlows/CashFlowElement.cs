using System.Globalization;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// One labelled part of a cash-flow model. Receipts are positive, disbursements negative; amounts fall at the end of
/// their period and period 0 is now. Each element expands to flows per period and also has a closed-form present worth
/// from the compound-interest factors; the two agree.
/// </summary>
public abstract record CashFlowElement(string Label, CashFlowCategory Category)
{
    /// <summary>Largest magnitude of an entered amount or step.</summary>
    public const double MaxAmount = 1e12;

    /// <summary>Largest magnitude any expanded flow may reach.</summary>
    public const double MaxFlow = 1e15;

    /// <summary>Longest label.</summary>
    public const int MaxLabelLength = 120;

    /// <summary>
    /// For a capital element: its outlays after period 0 are repairs deducted in their year, not assets depreciated
    /// from their year (see <see cref="Taxes.OutlayAssets"/>).
    /// </summary>
    public bool Expensed { get; init; }

    /// <summary>For a capital element after period 0: its own class or life as an asset; null for the first cost's.</summary>
    public Depreciation.OutlayClass? DepreciatedAs { get; init; }

    /// <summary>First period with a flow.</summary>
    public abstract int FirstPeriod { get; }

    /// <summary>Last period with a flow.</summary>
    public abstract int LastPeriod { get; }

    /// <summary>Adds this element's flows to <paramref name="flows"/>, indexed by period.</summary>
    public abstract void AddTo(Span<double> flows);

    /// <summary>Present worth at time 0 at an effective rate <paramref name="i"/> per period, from the factors.</summary>
    public abstract double PresentWorth(double i);

    /// <summary>The field that controls how large the expanded flows grow, named when they overflow.</summary>
    internal virtual string GrowthField => "amount";

    /// <summary>Names every problem with this element's own fields, under <paramref name="path"/>.</summary>
    public virtual IReadOnlyList<InputError> Check(string path, int horizon)
    {
        var errors = new List<InputError>();
        if (string.IsNullOrWhiteSpace(Label))
        {
            errors.Add(new($"{path}.label", "Give the element a label."));
        }
        else if (Label.Length > MaxLabelLength)
        {
            errors.Add(new($"{path}.label", Invariant($"The label is longer than {MaxLabelLength} characters.")));
        }
        if (!Enum.IsDefined(Category))
        {
            errors.Add(new($"{path}.category", "The category must be capital, operating, revenue, salvage or tax."));
        }
        CheckFields(path, horizon, errors);
        return errors;
    }

    /// <summary>Adds the problems with the fields particular to the element type.</summary>
    protected abstract void CheckFields(string path, int horizon, List<InputError> errors);

    protected static void CheckAmount(double value, string field, string path, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        if (!double.IsFinite(value))
        {
            errors.Add(new($"{path}.{field}", "Enter a finite number."));
        }
        else if (Math.Abs(value) > MaxAmount)
        {
            errors.Add(new($"{path}.{field}", "The magnitude must not exceed 1,000,000,000,000."));
        }
    }

    protected static void CheckSpan(int first, int last, int horizon, string path, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        if (first < 0)
        {
            errors.Add(new($"{path}.first", "The first period cannot be negative."));
        }
        else if (first > horizon)
        {
            errors.Add(new($"{path}.first", Invariant($"The first period is after the horizon ({horizon}).")));
        }
        if (last < first)
        {
            errors.Add(new($"{path}.last", "The last period comes before the first."));
        }
        else if (last > horizon)
        {
            errors.Add(new($"{path}.last", Invariant($"The last period is after the horizon ({horizon}).")));
        }
    }

    protected static string Invariant(FormattableString text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return text.ToString(CultureInfo.InvariantCulture);
    }
}
