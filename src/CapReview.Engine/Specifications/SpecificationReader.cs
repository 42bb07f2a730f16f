using CapReview.Engine.CashFlows;
using CapReview.Engine.Depreciation;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Inflation;
using CapReview.Engine.Rates;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Specifications;

/// <summary>Turns an entered <see cref="ModelSpec"/> into a validated model and rate, naming every missing or bad field.</summary>
public static class SpecificationReader
{
    /// <summary>The model and its evaluation options, or every error at once.</summary>
    public static Outcome<ReadSpecification> Read(ModelSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        var errors = new List<InputError>();
        AnnualRate? rate = ReadRate(spec.Rate, errors);
        GeneralInflation? inflation = ReadInflation(spec, errors);
        if (spec.Horizon is null)
        {
            errors.Add(new("horizon", "Give the horizon: the last period of the model."));
        }
        int periodsPerYear = spec.PeriodsPerYear ?? 1;
        var elements = new List<CashFlowElement>();
        if (spec.Elements is null)
        {
            errors.Add(new("elements", "Add at least one cash-flow element."));
        }
        else
        {
            for (int e = 0; e < spec.Elements.Count; e++)
            {
                CashFlowElement? element = ReadElement(spec.Elements[e], $"elements[{e}]", errors);
                if (element is not null && spec.Elements[e]!.Money == MoneyBasis.Constant)
                {
                    element = Escalate(element, spec.Elements[e]!, inflation, periodsPerYear, $"elements[{e}]", errors);
                }
                if (element is not null)
                {
                    element = ExpensedIfAsked(element, spec.Elements[e]!, $"elements[{e}]", errors);
                    elements.Add(DepreciatedAsIfAsked(element, spec.Elements[e]!, $"elements[{e}]", errors));
                }
            }
        }
        ElementIdentity.Check(spec.Elements, errors);
        bool elementsRead = spec.Elements is not null && elements.Count == spec.Elements.Count;
        Outcome<CashFlowModel>? model = spec.Horizon is int horizon && elementsRead
            ? CashFlowModel.Create(horizon, periodsPerYear, elements)
            : null;
        if (model is { IsValid: false })
        {
            // Report the model's problems beside the rate's, so that one round trip shows them all.
            errors.AddRange(model.Errors);
        }
        if (errors.Count > 0)
        {
            return Outcome.Failure<ReadSpecification>(errors);
        }
        // A real MARR meets actual money at its market equivalent, (1 + real)(1 + inflation) − 1, which must itself be
        // a rate the model can be discounted at.
        AnnualRate marr = rate!.Value;
        if (inflation is { RealMarr: true } real)
        {
            double market = InflationAdjustment.MarketRate(marr.EffectiveAnnual(), real.Rate);
            if (!MarrBounds.Allows(market))
            {
                return Outcome.Failure<ReadSpecification>([new("inflation.rate",
                    "With a real MARR, the market rate (1 + MARR)(1 + inflation) − 1 must be between −40% and 1000% a year: change the inflation or the MARR.")]);
            }
            marr = AnnualRate.Effective(market);
        }
        return Outcome.Success(new ReadSpecification(model!.Value!, new EvaluationOptions(marr)));
    }

    private sealed record GeneralInflation(double Rate, int BaseYear, bool RealMarr);

    private static GeneralInflation? ReadInflation(ModelSpec spec, List<InputError> errors)
    {
        if (spec.Inflation is not { } entered)
        {
            return null;
        }
        if (entered.Rate is not double rate || !double.IsFinite(rate) || rate <= -1 || rate > 10)
        {
            errors.Add(new("inflation.rate", "Give general inflation as a yearly rate above −100%, e.g. 0.02 for 2%."));
            return null;
        }
        int baseYear = entered.BaseYear ?? 0;
        if (baseYear is < 0 or > 100)
        {
            errors.Add(new("inflation.baseYear", "The base year is 0 (today's money) to 100."));
            return null;
        }
        return new GeneralInflation(rate, baseYear, entered.RealMarr ?? false);
    }

    private static EscalatedElement? Escalate(CashFlowElement element, ElementSpec spec, GeneralInflation? inflation, int periodsPerYear, string path, List<InputError> errors)
    {
        double? yearly = spec.Escalation ?? inflation?.Rate;
        if (yearly is not double escalation)
        {
            errors.Add(new($"{path}.escalation", "An element in constant money needs its escalation, or the general inflation rate (inflation.rate)."));
            return null;
        }
        if (!double.IsFinite(escalation) || escalation <= -1 || escalation > 10)
        {
            errors.Add(new($"{path}.escalation", "The escalation must be above −100% and at most 1000% a year."));
            return null;
        }
        double perPeriod = Math.Exp(Numerics.StableMath.Log1p(escalation) / periodsPerYear) - 1.0;
        return new EscalatedElement(element, perPeriod, (inflation?.BaseYear ?? 0) * periodsPerYear);
    }

    private static AnnualRate? ReadRate(RateSpec? spec, List<InputError> errors)
    {
        if (spec?.Value is not double value)
        {
            errors.Add(new("rate.value", "Give the MARR as an annual rate, e.g. 0.10 for 10%."));
            return null;
        }
        RateBasis basis = spec.Basis ?? RateBasis.Effective;
        int m = spec.CompoundingsPerYear ?? (basis == RateBasis.Nominal ? 0 : 1);
        if (basis == RateBasis.Nominal && spec.CompoundingsPerYear is null)
        {
            errors.Add(new("rate.compoundingsPerYear", "A nominal rate needs its compoundings per year."));
            return null;
        }
        IReadOnlyList<InputError> rateErrors = MarrBounds.Check(value, basis, m, "rate");
        if (rateErrors.Count > 0)
        {
            errors.AddRange(rateErrors);
            return null;
        }
        return AnnualRate.Create(value, basis, m);
    }

    private static CashFlowElement? ReadElement(ElementSpec? spec, string path, List<InputError> errors)
    {
        if (spec is null)
        {
            errors.Add(new(path, "The element is missing."));
            return null;
        }
        int before = errors.Count;
        if (spec.Type is null)
        {
            errors.Add(new($"{path}.type", "Choose the element type: single, uniform, arithmetic, geometric or recurring."));
            return null;
        }
        if (spec.Category is null)
        {
            errors.Add(new($"{path}.category", "Choose the category: capital, operating, revenue, salvage or tax."));
        }
        ElementKind kind = spec.Type.Value;
        double amount = Required(spec.Amount, "amount", path, errors);
        int first = kind == ElementKind.Single ? 0 : Required(spec.First, "first", path, errors);
        int last = kind == ElementKind.Single ? 0 : Required(spec.Last, "last", path, errors);
        int period = kind == ElementKind.Single ? Required(spec.Period, "period", path, errors) : 0;
        double step = kind == ElementKind.Arithmetic ? Required(spec.Step, "step", path, errors) : 0;
        double growth = kind == ElementKind.Geometric ? Required(spec.Growth, "growth", path, errors) : 0;
        int every = kind == ElementKind.Recurring ? Required(spec.Every, "every", path, errors) : 0;
        if (errors.Count > before)
        {
            return null;
        }
        string label = spec.Label ?? "";
        CashFlowCategory category = spec.Category!.Value;
        return kind switch
        {
            ElementKind.Single => new SingleAmount(label, category, period, amount),
            ElementKind.Uniform => new UniformSeries(label, category, first, last, amount),
            ElementKind.Arithmetic => new ArithmeticGradientSeries(label, category, first, last, amount, step),
            ElementKind.Geometric => new GeometricGradientSeries(label, category, first, last, amount, growth),
            ElementKind.Recurring => new RecurringAmount(label, category, first, last, every, amount),
            _ => Unknown(path, errors),
        };
    }

    /// <summary>Only a capital outlay after the first cost can be a repair; on any other element the flag would be ignored.</summary>
    private static CashFlowElement ExpensedIfAsked(CashFlowElement element, ElementSpec spec, string path, List<InputError> errors)
    {
        if (spec.Expensed is not true)
        {
            return element;
        }
        if (!ElementFields.MayBeExpensed(element.Category, element.FirstPeriod))
        {
            errors.Add(new($"{path}.expensed", "Only a capital cost after period 0 can be deducted as a repair in its year."));
        }
        return element with { Expensed = true };
    }

    /// <summary>
    /// Only a capital outlay after the first cost, not a repair, can have its own class or life; whether a class or a
    /// life fits is for the tax reader, which knows the first cost's method.
    /// </summary>
    private static CashFlowElement DepreciatedAsIfAsked(CashFlowElement element, ElementSpec spec, string path, List<InputError> errors)
    {
        if (spec.DepreciatedAs is not { } own)
        {
            return element;
        }
        string field = $"{path}.depreciatedAs";
        if (!ElementFields.MayBeExpensed(element.Category, element.FirstPeriod))
        {
            errors.Add(new(field, "Only a capital cost after period 0 can be depreciated by a class or life of its own."));
        }
        else if (element.Expensed)
        {
            errors.Add(new(field, "A repair is deducted in its year: untick the repair to depreciate it by a class or life of its own."));
        }
        else if (own.PropertyClass is not null && own.Life is not null)
        {
            errors.Add(new(field, "Give either a MACRS property class or a life, not both."));
        }
        else if (own.PropertyClass is MacrsClass c && !Enum.IsDefined(c))
        {
            errors.Add(new(field, "Choose one of the MACRS property classes."));
        }
        else if (own.Life is int life && life is < 1 or > 100)
        {
            errors.Add(new(field, "Give a life of 1 to 100 years."));
        }
        return element with { DepreciatedAs = own };
    }

    private static CashFlowElement? Unknown(string path, List<InputError> errors)
    {
        errors.Add(new($"{path}.type", "Choose the element type: single, uniform, arithmetic, geometric or recurring."));
        return null;
    }

    private static T Required<T>(T? value, string field, string path, List<InputError> errors)
        where T : struct
    {
        if (value is null)
        {
            errors.Add(new($"{path}.{field}", $"Give the {field} of this element."));
            return default;
        }
        return value.Value;
    }
}

/// <summary>A validated model with the options to evaluate it at.</summary>
public sealed record ReadSpecification(CashFlowModel Model, EvaluationOptions Options);
