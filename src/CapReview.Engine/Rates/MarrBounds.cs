using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Rates;

/// <summary>
/// The range in which a rate a model is discounted at (a MARR, an after-tax MARR) may be entered: an effective annual
/// rate of at least −40% and at most 1000%. The lower bound is where discounting stops giving numbers: at a rate i the
/// worth of the last period's flow is multiplied by (1 + i)^−n, and over the longest horizon (1,200 periods of a year
/// each) a rate below about −42.4% makes that factor, times the largest net flows a model can hold (500 elements of
/// 10^15 over 1,201 periods), pass the largest double (about 1.8 × 10^308). −40% keeps every legal model's present worth
/// representable, with room: (1 − 0.4)^−1200 ≈ 10^266. There is no bound near zero: every factor tends to its limit at
/// i = 0 and is computed to it, however small the rate (see docs/methods.md, "Limits of the input").
/// </summary>
public static class MarrBounds
{
    /// <summary>The lowest effective annual rate a model may be discounted at when entered: −40%.</summary>
    public const double LowestEffectiveAnnual = -0.40;

    /// <summary>The message for a rate below <see cref="LowestEffectiveAnnual"/>, in words a person reading a form knows.</summary>
    public static readonly string BelowLowest = string.Create(CultureInfo.InvariantCulture,
        $"The rate must be at least −40% a year (effective): below it, discounting a long model makes worths larger than any number the engine can hold.");

    /// <summary>
    /// Every problem with an entered rate, with field paths under <paramref name="path"/>: those of
    /// <see cref="AnnualRate.Check"/> and, for a rate otherwise valid, the lower bound.
    /// </summary>
    public static IReadOnlyList<InputError> Check(double value, RateBasis basis, int compoundingsPerYear, string path)
    {
        IReadOnlyList<InputError> errors = AnnualRate.Check(value, basis, compoundingsPerYear, path);
        if (errors.Count > 0)
        {
            return errors;
        }
        return AnnualRate.Create(value, basis, compoundingsPerYear).EffectiveAnnual() < LowestEffectiveAnnual
            ? [new($"{path}.value", BelowLowest)]
            : [];
    }

    /// <summary>Whether an effective annual rate lies in the entered range.</summary>
    public static bool Allows(double effectiveAnnual) =>
        effectiveAnnual >= LowestEffectiveAnnual && effectiveAnnual <= AnnualRate.MaxEffectiveAnnual;

    /// <summary>
    /// The largest factor (1 + i)^−t the bound allows, for the tests and the documentation: (1 − 0.4)^−1200 per year
    /// over the longest horizon, times the largest sum of net flows of a model.
    /// </summary>
    public static double LargestDiscountedSum =>
        Math.Exp(-CompoundInterest.MaxPeriods * Math.Log(1 + LowestEffectiveAnnual)) * CashFlowModel.MaxElements * CashFlowElement.MaxFlow * (CompoundInterest.MaxPeriods + 1);
}
