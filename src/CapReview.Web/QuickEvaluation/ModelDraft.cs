using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;

namespace CapReview.Web.QuickEvaluation;

/// <summary>The quick evaluation's model as typed: settings and element rows, read into a specification on demand.</summary>
public sealed class ModelDraft
{
    public string Horizon { get; set; } = "10";

    public int PeriodsPerYear { get; set; } = 1;

    /// <summary>The MARR in percent.</summary>
    public string MarrPercent { get; set; } = "10";

    public RateBasis Basis { get; set; } = RateBasis.Effective;

    public string CompoundingsPerYear { get; set; } = "12";

    public List<ElementDraft> Elements { get; } = [];

    /// <summary>General inflation in percent a year; blank when every amount is in actual money.</summary>
    public string InflationPercent { get; set; } = "";

    /// <summary>The MARR typed is a real (inflation-free) rate.</summary>
    public bool RealMarr { get; set; }

    /// <summary>The year whose money constant amounts are in (0: today's).</summary>
    public string BaseYear { get; set; } = "0";

    /// <summary>The draft of a stored model, its numbers written in <paramref name="culture"/> as a person would type them.</summary>
    public static ModelDraft FromSpec(ModelSpec spec, CultureInfo culture, double marrPercent)
    {
        ArgumentNullException.ThrowIfNull(spec);
        string Number(double? value) => ElementDraft.Number(value, culture);
        string Whole(int? value) => value?.ToString(culture) ?? "";
        var draft = new ModelDraft
        {
            Horizon = Whole(spec.Horizon),
            PeriodsPerYear = spec.PeriodsPerYear ?? 1,
            MarrPercent = Number(marrPercent),
            InflationPercent = spec.Inflation?.Rate is double inflation ? Number(inflation * 100) : "",
            RealMarr = spec.Inflation?.RealMarr ?? false,
            BaseYear = Whole(spec.Inflation?.BaseYear ?? 0),
        };
        foreach (ElementSpec? e in spec.Elements ?? [])
        {
            if (e is null)
            {
                continue;
            }
            draft.Elements.Add(ElementDraft.FromSpec(e, culture));
        }
        return draft;
    }

    public void Move(int index, int offset)
    {
        int target = index + offset;
        if (index < 0 || index >= Elements.Count || target < 0 || target >= Elements.Count)
        {
            return;
        }
        (Elements[index], Elements[target]) = (Elements[target], Elements[index]);
    }

    /// <summary>Reads the typed text in <paramref name="culture"/>; a field that does not parse is named and left out.</summary>
    public DraftReading Read(CultureInfo culture)
    {
        var errors = new List<InputError>();
        var elements = new List<ElementSpec>();
        for (int e = 0; e < Elements.Count; e++)
        {
            ElementDraft row = Elements[e];
            string path = $"elements[{e}]";
            elements.Add(new ElementSpec
            {
                Id = row.Id,
                Type = row.Type,
                Label = row.Label,
                Category = row.Category,
                Period = row.Uses("period") ? Whole(row.Period, $"{path}.period", culture, errors) : null,
                First = row.Uses("first") ? Whole(row.First, $"{path}.first", culture, errors) : null,
                Last = row.Uses("last") ? Whole(row.Last, $"{path}.last", culture, errors) : null,
                Every = row.Uses("every") ? Whole(row.Every, $"{path}.every", culture, errors) : null,
                Amount = Real(row.Amount, $"{path}.amount", culture, errors),
                Step = row.Uses("step") ? Real(row.Step, $"{path}.step", culture, errors) : null,
                Growth = row.Uses("growth") ? Real(row.GrowthPercent, $"{path}.growth", culture, errors) / 100.0 : null,
                Money = row.Money == Engine.Inflation.MoneyBasis.Constant ? Engine.Inflation.MoneyBasis.Constant : null,
                Escalation = row.Uses("escalation") && row.EscalationPercent.Trim().Length > 0
                    ? Real(row.EscalationPercent, $"{path}.escalation", culture, errors) / 100.0 : null,
                Expensed = row.Expensed ? true : null,
                DepreciatedAs = row.OwnClass is Engine.Depreciation.MacrsClass own ? new Engine.Depreciation.OutlayClass { PropertyClass = own }
                    : row.OwnLife.Trim().Length > 0 ? new Engine.Depreciation.OutlayClass { Life = Whole(row.OwnLife, $"{path}.depreciatedAs", culture, errors) } : null,
            });
        }
        var spec = new ModelSpec
        {
            Horizon = Whole(Horizon, "horizon", culture, errors),
            PeriodsPerYear = PeriodsPerYear,
            Rate = new RateSpec
            {
                Value = Real(MarrPercent, "rate.value", culture, errors) / 100.0,
                Basis = Basis,
                CompoundingsPerYear = Basis == RateBasis.Nominal ? Whole(CompoundingsPerYear, "rate.compoundingsPerYear", culture, errors) : null,
            },
            Elements = elements,
            Inflation = InflationPercent.Trim().Length == 0 && !RealMarr ? null : new InflationSpec
            {
                Rate = InflationPercent.Trim().Length == 0 ? 0 : Real(InflationPercent, "inflation.rate", culture, errors) / 100.0,
                BaseYear = Whole(BaseYear.Trim().Length == 0 ? "0" : BaseYear, "inflation.baseYear", culture, errors),
                RealMarr = RealMarr ? true : null,
            },
        };
        return new DraftReading(spec, errors);
    }

    private static int? Whole(string text, string field, CultureInfo culture, List<InputError> errors)
    {
        if (int.TryParse(text.Trim(), NumberStyles.AllowLeadingSign, culture, out int value))
        {
            return value;
        }
        errors.Add(new(field, string.IsNullOrWhiteSpace(text) ? "Enter a whole number of periods." : $"“{text.Trim()}” is not a whole number."));
        return null;
    }

    private static double? Real(string text, string field, CultureInfo culture, List<InputError> errors)
    {
        string trimmed = text.Trim().Replace('−', '-');
        if (double.TryParse(trimmed, NumberStyles.Float | NumberStyles.AllowThousands, culture, out double value) && double.IsFinite(value))
        {
            return value;
        }
        errors.Add(new(field, string.IsNullOrWhiteSpace(text) ? "Enter a number." : $"“{text.Trim()}” is not a number."));
        return null;
    }
}

/// <summary>What the typed draft says: a specification with unreadable fields left empty, and the reading errors.</summary>
public sealed record DraftReading(ModelSpec Spec, IReadOnlyList<InputError> Errors);
