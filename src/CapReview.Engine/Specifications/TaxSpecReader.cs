using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Taxes;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Specifications;

/// <summary>Turns an entered <see cref="TaxSpec"/> into <see cref="TaxSettings"/> for a model, naming every bad field under "tax".</summary>
public static class TaxSpecReader
{
    public static Outcome<TaxSettings> Read(TaxSpec spec, CashFlowModel model)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(model);
        var errors = new List<InputError>();
        if (model.PeriodsPerYear != 1)
        {
            errors.Add(new("periodsPerYear", "The after-tax analysis works in tax years: use yearly periods."));
        }
        double rate = Rate(spec.IncomeTaxRate, "tax.incomeTaxRate", errors, required: true);
        if (spec.StateTaxRate is not null)
        {
            double state = Rate(spec.StateTaxRate, "tax.stateTaxRate", errors, required: true);
            rate = errors.Count == 0 ? TaxRates.Combined(rate, state) : rate;
        }
        double? gain = spec.GainTaxRate is null ? null : Rate(spec.GainTaxRate, "tax.gainTaxRate", errors, required: true);
        double firstCost = Math.Max(0, -Enumerable.Range(0, model.Elements.Count)
            .Where(e => model.Elements[e].Category == CashFlowCategory.Capital).Sum(e => model.FlowsOf(e)[0]));
        var (schedule, share) = ReadDepreciation(spec.Depreciation, firstCost, errors);

        var credits = new List<TaxCredit>();
        for (int k = 0; k < (spec.Credits?.Count ?? 0); k++)
        {
            TaxCreditSpec? c = spec.Credits![k];
            if (c?.Year is not int year || year < 0 || year > model.Horizon)
            {
                errors.Add(new($"tax.credits[{k}].year", $"Give the year of the credit, 0 to {model.Horizon}."));
            }
            else if (c.Amount is not double amount || !double.IsFinite(amount) || amount < 0 || amount > CashFlowElement.MaxAmount)
            {
                errors.Add(new($"tax.credits[{k}].amount", "Give the credit as an amount, zero or more."));
            }
            else
            {
                credits.Add(new TaxCredit(year, amount));
            }
        }

        Loan? loan = null;
        if (spec.Loan is { } l)
        {
            double loanShare = Rate(l.Share, "tax.loan.share", errors, required: true, allowOne: true);
            double loanRate = Rate(l.Rate, "tax.loan.rate", errors, required: true);
            if (l.Term is not int term || term is < 1 or > 100)
            {
                errors.Add(new("tax.loan.term", "Give the loan's term, 1 to 100 years."));
            }
            else
            {
                loan = new Loan(loanShare, loanRate, term);
            }
        }
        if (spec.Losses is LossTreatment losses && !Enum.IsDefined(losses))
        {
            errors.Add(new("tax.losses", "Choose offset or carryForward."));
        }
        if (schedule is not null)
        {
            OutlayClassCheck.Check(spec.Depreciation!, model, errors);
        }
        if (errors.Count > 0 || schedule is null)
        {
            return Outcome.Failure<TaxSettings>(errors);
        }
        return Outcome.Success(new TaxSettings(rate, schedule, share, gain, spec.Losses ?? LossTreatment.Offset, credits, loan,
            OutlayDepreciationReader.Read(spec.Depreciation!, share)));
    }

    private static (DepreciationSchedule? Schedule, double DisposalShare) ReadDepreciation(DepreciationSpec? spec, double firstCost, List<InputError> errors)
    {
        const string path = "tax.depreciation";
        if (spec?.Method is not DepreciationMethod method || !Enum.IsDefined(method))
        {
            errors.Add(new($"{path}.method", "Choose the depreciation method: straightLine, decliningBalance, sumOfYearsDigits, unitsOfProduction or macrs."));
            return (null, 1);
        }
        double basis = spec.Basis ?? firstCost;
        if (!double.IsFinite(basis) || basis < 0 || basis > CashFlowElement.MaxAmount)
        {
            errors.Add(new($"{path}.basis", "The depreciable basis must be an amount, zero or more."));
            return (null, 1);
        }
        double salvage = spec.Salvage ?? 0;
        if (!double.IsFinite(salvage) || salvage < 0 || salvage > basis)
        {
            errors.Add(new($"{path}.salvage", "The salvage must be from zero to the basis."));
            return (null, 1);
        }
        // A quarter or month that the chosen depreciation does not read would be stored and silently ignored.
        bool periodsRead = method == DepreciationMethod.Macrs && spec.Convention is MacrsConvention.MidQuarter or MacrsConvention.MidMonth
            || method == DepreciationMethod.Macrs && spec.Convention is null && spec.PropertyClass is MacrsClass.ResidentialRental or MacrsClass.Nonresidential;
        if (!periodsRead && (spec.PlacedInPeriod is not null || spec.DisposalPeriod is not null))
        {
            string field = spec.PlacedInPeriod is not null ? "placedInPeriod" : "disposalPeriod";
            errors.Add(new($"{path}.{field}", "Only MACRS with the mid-quarter or mid-month convention takes a quarter or month placed in service or of disposal; leave it out."));
            return (null, 1);
        }
        if (method == DepreciationMethod.Macrs)
        {
            if (spec.PropertyClass is not MacrsClass propertyClass || !Enum.IsDefined(propertyClass))
            {
                errors.Add(new($"{path}.propertyClass", "Choose the MACRS property class."));
                return (null, 1);
            }
            bool real = propertyClass is MacrsClass.ResidentialRental or MacrsClass.Nonresidential;
            MacrsConvention convention = spec.Convention ?? (real ? MacrsConvention.MidMonth : MacrsConvention.HalfYear);
            if (real != (convention == MacrsConvention.MidMonth))
            {
                errors.Add(new($"{path}.convention", "Real property takes the mid-month convention; other property the half-year or mid-quarter one."));
                return (null, 1);
            }
            int periods = convention == MacrsConvention.MidMonth ? 12 : 4;
            if (convention != MacrsConvention.HalfYear && (spec.PlacedInPeriod is not int placed || placed < 1 || placed > periods))
            {
                errors.Add(new($"{path}.placedInPeriod", convention == MacrsConvention.MidMonth ? "Give the month placed in service, 1 to 12." : "Give the quarter placed in service, 1 to 4."));
                return (null, 1);
            }
            if (spec.DisposalPeriod is int disposal && (disposal < 1 || disposal > periods))
            {
                errors.Add(new($"{path}.disposalPeriod", convention == MacrsConvention.MidMonth ? "The month of disposal is 1 to 12." : "The quarter of disposal is 1 to 4."));
                return (null, 1);
            }
            // Sold at the horizon: unless its quarter or month is given, at the end of the year's last one.
            return (Macrs.Schedule(basis, propertyClass, convention, spec.PlacedInPeriod ?? 1),
                Macrs.DisposalYearShare(convention, spec.DisposalPeriod ?? periods));
        }
        if (method == DepreciationMethod.UnitsOfProduction)
        {
            if (spec.TotalUnits is not double total || !(total > 0) || spec.UnitsByYear is not { Count: > 0 } units || units.Any(u => !(u >= 0)) || units.Sum() > total * (1 + 1e-12))
            {
                errors.Add(new($"{path}.unitsByYear", "Give the total units expected and the units of each year, not more than the total."));
                return (null, 1);
            }
            return (BookDepreciation.UnitsOfProduction(basis, salvage, total, units), 1);
        }
        if (spec.Life is not int life || life is < 1 or > 100)
        {
            errors.Add(new($"{path}.life", "Give the depreciation life, 1 to 100 years."));
            return (null, 1);
        }
        switch (method)
        {
            case DepreciationMethod.StraightLine:
                return (BookDepreciation.StraightLine(basis, salvage, life), 1);
            case DepreciationMethod.SumOfYearsDigits:
                return (BookDepreciation.SumOfYearsDigits(basis, salvage, life), 1);
            default:
                double factor = spec.Factor ?? 2.0;
                if (!(factor > 0) || factor > life)
                {
                    errors.Add(new($"{path}.factor", "The declining-balance factor is above 0 and at most the life, e.g. 2 for 200 %."));
                    return (null, 1);
                }
                return (BookDepreciation.DecliningBalance(basis, salvage, life, factor, spec.SwitchToStraightLine ?? true), 1);
        }
    }

    private static double Rate(double? value, string field, List<InputError> errors, bool required, bool allowOne = false)
    {
        if (value is not double v)
        {
            if (required)
            {
                errors.Add(new(field, "Give the rate as a fraction, e.g. 0.25 for 25%."));
            }
            return 0;
        }
        if (!double.IsFinite(v) || v < 0 || (allowOne ? v > 1 : v >= 1))
        {
            errors.Add(new(field, allowOne ? "The share is from 0 to 1." : "The rate is from 0 to below 1 (100%)."));
            return 0;
        }
        return v;
    }
}
