using System.Globalization;
using System.Text.RegularExpressions;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Risk;

/// <summary>Which figure a sensitivity or risk analysis follows.</summary>
public enum RiskMeasure
{
    PresentWorth,
    AnnualWorth,
}

/// <summary>
/// A proposal as entered (its model and, when it is taxed, its tax settings) whose inputs can be set one at a time:
/// the unit every sensitivity, break-even and simulation works on. After tax, the figures are the after-tax ones.
/// </summary>
public sealed partial record ProposalCase(ModelSpec Model, TaxSpec? Tax = null)
{
    /// <summary>The case with the input at <paramref name="target"/> set to <paramref name="value"/>.</summary>
    public ProposalCase With(string target, double value)
    {
        ArgumentNullException.ThrowIfNull(target);
        if (target == "rate")
        {
            return this with { Model = Model with { Rate = (Model.Rate ?? new RateSpec()) with { Value = value } } };
        }
        if (target == "horizon")
        {
            return this with { Model = Model with { Horizon = (int)Math.Round(value, MidpointRounding.AwayFromZero) } };
        }
        if (target == "inflation.rate")
        {
            return this with { Model = Model with { Inflation = (Model.Inflation ?? new InflationSpec()) with { Rate = value } } };
        }
        if (target == "tax.incomeTaxRate")
        {
            return this with { Tax = (Tax ?? throw new ArgumentException("The proposal has no tax settings.", nameof(target))) with { IncomeTaxRate = value } };
        }
        if (ElementTarget(Resolve(target) ?? throw new ArgumentException($"No element of the model has the identity in “{target}”.", nameof(target))) is not var (index, field))
        {
            throw new ArgumentException($"“{target}” is not an input that can be varied.", nameof(target));
        }
        var elements = (Model.Elements ?? []).ToArray();
        if (index >= elements.Length || elements[index] is not { } element)
        {
            throw new ArgumentException($"There is no element {index + 1} to vary.", nameof(target));
        }
        int whole = (int)Math.Round(value, MidpointRounding.AwayFromZero);
        elements[index] = field switch
        {
            "amount" => element with { Amount = value },
            "step" => element with { Step = value },
            "growth" => element with { Growth = value },
            "escalation" => element with { Escalation = value },
            "first" => element with { First = whole },
            "last" => element with { Last = whole },
            _ => element with { Period = whole },
        };
        return this with { Model = Model with { Elements = elements } };
    }

    /// <summary>Whether <paramref name="target"/> names an input of this proposal that <see cref="With"/> can set.</summary>
    public bool CanVary(string target) => target switch
    {
        "rate" or "horizon" or "inflation.rate" => true,
        "tax.incomeTaxRate" => Tax is not null,
        _ => Resolve(target) is { } resolved && ElementTarget(resolved) is var (index, _) && index < (Model.Elements?.Count ?? 0) && Model.Elements![index] is not null,
    };

    /// <summary>The value now at <paramref name="target"/>, or null when it is not set.</summary>
    public double? ValueAt(string target)
    {
        ArgumentNullException.ThrowIfNull(target);
        if (Resolve(target) is not { } resolved)
        {
            return null;
        }
        if (ElementTarget(resolved) is var (index, field))
        {
            ElementSpec? e = index < (Model.Elements?.Count ?? 0) ? Model.Elements![index] : null;
            return field switch
            {
                "amount" => e?.Amount,
                "step" => e?.Step,
                "growth" => e?.Growth,
                "escalation" => e?.Escalation,
                "first" => e?.First,
                "last" => e?.Last,
                _ => e?.Period,
            };
        }
        return target switch
        {
            "rate" => Model.Rate?.Value,
            "horizon" => Model.Horizon,
            "inflation.rate" => Model.Inflation?.Rate,
            "tax.incomeTaxRate" => Tax?.IncomeTaxRate,
            _ => null,
        };
    }

    /// <summary>
    /// The positional form of a target that names an element by its identity (other targets unchanged), or null when
    /// no element has that identity.
    /// </summary>
    public string? Resolve(string target) => ElementIdentity.Resolve(target, Model.Elements);

    /// <summary>The case's evaluation: after tax when it has tax settings.</summary>
    public Outcome<Evaluation.Evaluation> Evaluate()
    {
        if (Tax is null)
        {
            return Evaluator.Evaluate(Model);
        }
        var after = AfterTaxEvaluator.Evaluate(Model, Tax);
        return after.IsValid ? Outcome.Success(after.Value!.AfterTax) : Outcome.Failure<Evaluation.Evaluation>(after.Errors);
    }

    /// <summary>The measure of the case, or NaN when the inputs make no valid model.</summary>
    public double Measure(RiskMeasure measure)
    {
        var outcome = Evaluate();
        return outcome.Value is not { } e ? double.NaN : measure == RiskMeasure.AnnualWorth ? e.AnnualWorth : e.PresentWorth;
    }

    /// <summary>The element and field of a target such as <c>elements[2].amount</c>, or null for any other target.</summary>
    internal static (int Index, string Field)? ElementTarget(string target)
    {
        Match m = ElementField().Match(target);
        return m.Success ? (int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), m.Groups[2].Value) : null;
    }

    [GeneratedRegex(@"^elements\[(\d+)\]\.(amount|step|growth|escalation|first|last|period)$")]
    private static partial Regex ElementField();
}
