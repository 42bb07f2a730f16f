using System.Globalization;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using CapReview.Engine.Taxes;
using CapReview.Engine.Validation;

namespace CapReview.Web.ProposalForms;

/// <summary>One tax credit as typed.</summary>
public sealed class CreditDraft
{
    public string Year { get; set; } = "1";

    public string Amount { get; set; } = "0";
}

/// <summary>
/// The tax and depreciation settings as a lead types them (percentages in percent, in the organisation's culture);
/// read into a <see cref="TaxSpec"/> with every unreadable field named under "tax".
/// </summary>
public sealed class TaxDraft
{
    public bool Enabled { get; set; }

    public string IncomeTaxPercent { get; set; } = "25";

    public string StateTaxPercent { get; set; } = "";

    public string GainTaxPercent { get; set; } = "";

    public DepreciationMethod Method { get; set; } = DepreciationMethod.Macrs;

    public string Life { get; set; } = "10";

    public string Salvage { get; set; } = "0";

    public string FactorPercent { get; set; } = "200";

    public bool SwitchToStraightLine { get; set; } = true;

    public MacrsClass PropertyClass { get; set; } = MacrsClass.SevenYear;

    public MacrsConvention Convention { get; set; } = MacrsConvention.HalfYear;

    public string PlacedInPeriod { get; set; } = "1";

    public string TotalUnits { get; set; } = "";

    /// <summary>Units of each year, separated by semicolons.</summary>
    public string UnitsByYear { get; set; } = "";

    public LossTreatment Losses { get; set; } = LossTreatment.Offset;

    public List<CreditDraft> Credits { get; } = [];

    public bool Financed { get; set; }

    public string LoanSharePercent { get; set; } = "50";

    public string LoanRatePercent { get; set; } = "6";

    public string LoanTerm { get; set; } = "5";

    /// <summary>The after-tax MARR in percent; blank for the policy's (or the MARR times one less the tax rate).</summary>
    public string AfterTaxMarrPercent { get; set; } = "";

    public static TaxDraft From(TaxSpec? spec, CultureInfo culture)
    {
        var draft = new TaxDraft();
        if (spec is null)
        {
            return draft;
        }
        string Percent(double? v) => v is double x ? (x * 100).ToString("0.############", culture) : "";
        string Number(double? v) => v?.ToString("0.############", culture) ?? "";
        draft.Enabled = true;
        draft.IncomeTaxPercent = Percent(spec.IncomeTaxRate);
        draft.StateTaxPercent = Percent(spec.StateTaxRate);
        draft.GainTaxPercent = Percent(spec.GainTaxRate);
        if (spec.Depreciation is { } d)
        {
            draft.Method = d.Method ?? DepreciationMethod.StraightLine;
            // A method that stores no life (MACRS) keeps the new form's, so switching methods later never meets a blank field.
            draft.Life = d.Life?.ToString(culture) ?? draft.Life;
            draft.Salvage = Number(d.Salvage ?? 0);
            draft.FactorPercent = Percent(d.Factor ?? 2);
            draft.SwitchToStraightLine = d.SwitchToStraightLine ?? true;
            draft.PropertyClass = d.PropertyClass ?? MacrsClass.SevenYear;
            draft.Convention = d.Convention ?? MacrsConvention.HalfYear;
            draft.PlacedInPeriod = d.PlacedInPeriod?.ToString(culture) ?? "1";
            draft.TotalUnits = Number(d.TotalUnits);
            draft.UnitsByYear = string.Join("; ", (d.UnitsByYear ?? []).Select(u => u.ToString("0.############", culture)));
        }
        draft.Losses = spec.Losses ?? LossTreatment.Offset;
        draft.Credits.AddRange((spec.Credits ?? []).Where(c => c is not null).Select(c => new CreditDraft { Year = c!.Year?.ToString(culture) ?? "", Amount = Number(c.Amount) }));
        if (spec.Loan is { } loan)
        {
            draft.Financed = true;
            draft.LoanSharePercent = Percent(loan.Share);
            draft.LoanRatePercent = Percent(loan.Rate);
            draft.LoanTerm = loan.Term?.ToString(culture) ?? "";
        }
        draft.AfterTaxMarrPercent = Percent(spec.AfterTaxMarr?.Value);
        return draft;
    }

    /// <summary>The settings, null when the proposal is before tax, with the fields that did not parse.</summary>
    public (TaxSpec? Spec, IReadOnlyList<InputError> Errors) Read(CultureInfo culture)
    {
        if (!Enabled)
        {
            return (null, []);
        }
        var errors = new List<InputError>();
        double? Percent(string text, string field, bool optional = false)
        {
            if (optional && text.Trim().Length == 0)
            {
                return null;
            }
            return Number(text, field) / 100;
        }
        double? Number(string text, string field)
        {
            if (double.TryParse(text.Trim().Replace('−', '-'), NumberStyles.Float | NumberStyles.AllowThousands, culture, out double v) && double.IsFinite(v))
            {
                return v;
            }
            errors.Add(new(field, text.Trim().Length == 0 ? "Enter a number." : $"“{text.Trim()}” is not a number."));
            return null;
        }
        int? Whole(string text, string field)
        {
            if (int.TryParse(text.Trim(), NumberStyles.Integer, culture, out int v))
            {
                return v;
            }
            errors.Add(new(field, $"“{text.Trim()}” is not a whole number."));
            return null;
        }
        var depreciation = new DepreciationSpec
        {
            Method = Method,
            Life = Method is DepreciationMethod.StraightLine or DepreciationMethod.DecliningBalance or DepreciationMethod.SumOfYearsDigits ? Whole(Life, "tax.depreciation.life") : null,
            Salvage = Method == DepreciationMethod.Macrs ? null : Number(Salvage, "tax.depreciation.salvage"),
            Factor = Method == DepreciationMethod.DecliningBalance ? Percent(FactorPercent, "tax.depreciation.factor") : null,
            SwitchToStraightLine = Method == DepreciationMethod.DecliningBalance ? SwitchToStraightLine : null,
            PropertyClass = Method == DepreciationMethod.Macrs ? PropertyClass : null,
            Convention = Method == DepreciationMethod.Macrs ? Convention : null,
            PlacedInPeriod = Method == DepreciationMethod.Macrs && Convention != MacrsConvention.HalfYear ? Whole(PlacedInPeriod, "tax.depreciation.placedInPeriod") : null,
            TotalUnits = Method == DepreciationMethod.UnitsOfProduction ? Number(TotalUnits, "tax.depreciation.totalUnits") : null,
            UnitsByYear = Method == DepreciationMethod.UnitsOfProduction
                ? [.. UnitsByYear.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).Select((u, k) => Number(u, $"tax.depreciation.unitsByYear[{k}]") ?? 0)]
                : null,
        };
        var spec = new TaxSpec
        {
            IncomeTaxRate = Percent(IncomeTaxPercent, "tax.incomeTaxRate"),
            StateTaxRate = Percent(StateTaxPercent, "tax.stateTaxRate", optional: true),
            GainTaxRate = Percent(GainTaxPercent, "tax.gainTaxRate", optional: true),
            Depreciation = depreciation,
            Losses = Losses,
            Credits = Credits.Count == 0 ? null : [.. Credits.Select((c, k) => new TaxCreditSpec { Year = Whole(c.Year, $"tax.credits[{k}].year"), Amount = Number(c.Amount, $"tax.credits[{k}].amount") })],
            Loan = Financed ? new LoanSpec { Share = Percent(LoanSharePercent, "tax.loan.share"), Rate = Percent(LoanRatePercent, "tax.loan.rate"), Term = Whole(LoanTerm, "tax.loan.term") } : null,
            AfterTaxMarr = AfterTaxMarrPercent.Trim().Length == 0 ? null : new RateSpec { Value = Percent(AfterTaxMarrPercent, "tax.afterTaxMarr.value") },
        };
        return (spec, errors);
    }

    /// <summary>
    /// The model after tax with these settings: null with no errors when tax is off or there is no valid model yet,
    /// else the engine's evaluation or the fields that stop it.
    /// </summary>
    public (AfterTaxEvaluation? Result, IReadOnlyList<InputError> Errors) Evaluate(ModelSpec? model, CultureInfo culture)
    {
        var (spec, reading) = Read(culture);
        if (!Enabled || model is null)
        {
            return (null, []);
        }
        if (reading.Count > 0)
        {
            return (null, reading);
        }
        var outcome = AfterTaxEvaluator.Evaluate(model, spec!);
        return (outcome.Value, outcome.Errors);
    }
}
