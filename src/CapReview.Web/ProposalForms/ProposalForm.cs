using System.Globalization;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;

namespace CapReview.Web.ProposalForms;

/// <summary>
/// Everything of a proposal a lead types outside the cash-flow grid, as typed: its description, its own MARR, its
/// value at the study period's end, the replacement, tax and risk settings, and why a submitted version changes.
/// </summary>
public sealed class ProposalForm
{
    public string Title { get; set; } = "";

    public string Description { get; set; } = "";

    public ProposalCategory Category { get; set; } = ProposalCategory.Replacement;

    public RiskClass RiskClass { get; set; } = RiskClass.Standard;

    public string ChangeReason { get; set; } = "";

    public bool OverrideMarr { get; set; }

    public double OverridePercent { get; set; } = 12;

    public string OverrideReason { get; set; } = "";

    public string StudyEndValue { get; set; } = "";

    public ReplacementDraft Replacement { get; private set; } = new();

    public TaxDraft Tax { get; private set; } = new();

    public RiskDraft Risk { get; private set; } = new();

    /// <summary>The form filled from a proposal and its latest version's assumptions (stamped with element identities).</summary>
    public static ProposalForm From(ProposalView view, ProposalAssumptions assumptions, CultureInfo culture)
    {
        ArgumentNullException.ThrowIfNull(view);
        ArgumentNullException.ThrowIfNull(assumptions);
        var own = assumptions.MarrOverride;
        return new ProposalForm
        {
            Title = view.Title,
            Description = view.Description,
            Category = view.Category,
            RiskClass = view.RiskClass,
            OverrideMarr = own is not null,
            OverridePercent = (own?.Rate.Value ?? 0.12) * 100,
            OverrideReason = own?.Reason ?? "",
            StudyEndValue = assumptions.ValueAtStudyEnd is double end ? end.ToString("0.############", culture) : "",
            Replacement = ReplacementDraft.From(assumptions.Replacement, culture),
            Tax = TaxDraft.From(assumptions.Tax, culture),
            Risk = RiskDraft.From(assumptions.Risk, culture),
        };
    }

    /// <summary>The draft to save with the model from the grid; the first field that cannot be read is refused by its path.</summary>
    public ProposalDraft ToDraft(ModelSpec model, CultureInfo culture)
    {
        ArgumentNullException.ThrowIfNull(model);
        var (estimates, error) = Replacement.Read(culture);
        if (error is not null)
        {
            throw new RuleViolationException(error);
        }
        var (taxSpec, taxErrors) = Tax.Read(culture);
        if (taxErrors.Count > 0)
        {
            throw new RuleViolationException($"{taxErrors[0].Field}: {taxErrors[0].Message}");
        }
        var (riskSpec, riskErrors) = Risk.Read(culture);
        if (riskErrors.Count > 0)
        {
            throw new RuleViolationException($"{riskErrors[0].Field}: {riskErrors[0].Message}");
        }
        double? endValue = null;
        if (StudyEndValue.Trim().Length > 0)
        {
            endValue = double.TryParse(StudyEndValue.Trim(), NumberStyles.Number, culture, out double v) && double.IsFinite(v)
                ? v
                : throw new RuleViolationException("valueAtStudyEnd: the value at the end of the study period is not a number.");
        }
        return new(Title, Description, Category, RiskClass, new ProposalAssumptions
        {
            Model = model with { Rate = null },
            ValueAtStudyEnd = endValue,
            Replacement = estimates,
            Tax = taxSpec,
            Risk = riskSpec,
            MarrOverride = OverrideMarr
                ? new MarrOverride(new RateSpec { Value = OverridePercent / 100, Basis = CapReview.Engine.Rates.RateBasis.Effective }, OverrideReason)
                : null,
        },
        string.IsNullOrWhiteSpace(ChangeReason) ? null : ChangeReason);
    }
}
