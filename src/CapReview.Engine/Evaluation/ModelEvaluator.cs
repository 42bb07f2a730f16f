using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Validation;

namespace CapReview.Engine.Evaluation;

/// <summary>Computes every measure of worth of a validated model at a MARR.</summary>
public static class ModelEvaluator
{
    /// <summary>
    /// Every measure, for a model and MARR known to give a representable present worth (a MARR within
    /// <see cref="MarrBounds"/>, which every legal model's worth fits); throws otherwise. Use <see cref="TryEvaluate"/>
    /// where the MARR was moved from the one entered (a what-if shift, a drawn rate).
    /// </summary>
    public static Evaluation Evaluate(CashFlowModel model, EvaluationOptions options)
    {
        Outcome<Evaluation> outcome = TryEvaluate(model, options);
        return outcome.Value ?? throw new ArgumentOutOfRangeException(nameof(options), outcome.Errors[0].Message);
    }

    /// <summary>
    /// Every measure, or an error naming <c>rate.value</c> when the present or annual worth at this MARR is past every
    /// double (a rate near −100% over a long horizon). Every other measure that no double can hold, or that does not
    /// exist for these flows, is null with its reason in <see cref="Evaluation.Unavailable"/>; none is ever infinite or NaN.
    /// </summary>
    public static Outcome<Evaluation> TryEvaluate(CashFlowModel model, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(options);
        int p = model.PeriodsPerYear;
        int n = model.Horizon;
        double i = options.Marr.EffectivePerPeriod(p);
        double[] flows = [.. model.NetFlows];

        double ofNetFlows = FlowWorth.PresentWorth(flows, i);
        double closedForm = model.ClosedFormPresentWorth(i);
        // An escalated element's closed form discounts at its deflated rate, which can overflow in a part whose product
        // with the escalation is finite; the sum of the flows then stands in for it.
        double presentWorth = double.IsFinite(closedForm) ? closedForm : ofNetFlows;
        double periodWorth = presentWorth * CompoundInterest.CapitalRecovery(i, n);
        // A uniform amount each period is worth (F/A, i, p) times as much at each year end.
        double annualWorth = periodWorth * CompoundInterest.UniformSeriesCompoundAmount(i, p);
        if (!double.IsFinite(presentWorth) || !double.IsFinite(ofNetFlows) || !double.IsFinite(periodWorth) || !double.IsFinite(annualWorth))
        {
            return Outcome.Failure<Evaluation>([new("rate.value", string.Create(CultureInfo.InvariantCulture,
                $"At a MARR of {options.Marr.EffectiveAnnual() * 100:0.####}% a year the worth of this model is {UnavailableMeasures.BeyondRange}."))]);
        }

        double lowest = AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.LowestAnnual, p);
        double highest = AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.HighestAnnual, p);
        RateOfReturnResult rateOfReturn = RateOfReturnSearch.Find(flows, lowest, highest);
        double[] annualRoots = [.. rateOfReturn.Roots.Select(r => AnnualRate.AnnualEffectiveFromPeriod(r, p))];

        double finance = (options.FinanceRate ?? options.Marr).EffectivePerPeriod(p);
        double reinvestment = (options.ReinvestmentRate ?? options.Marr).EffectivePerPeriod(p);
        double? external = ExternalRateOfReturn.Compute(flows, finance, reinvestment) is double e ? AnnualRate.AnnualEffectiveFromPeriod(e, p) : null;

        var unavailable = new Dictionary<string, string>(StringComparer.Ordinal);
        double? futureWorth = Measure(presentWorth * CompoundInterest.SinglePaymentCompoundAmount(i, n), UnavailableMeasures.FutureWorth, UnavailableMeasures.BeyondRange, unavailable);
        double? capitalized = i > 0.0
            ? Measure(periodWorth / i, UnavailableMeasures.CapitalizedWorth, UnavailableMeasures.BeyondRange, unavailable)
            : Missing(UnavailableMeasures.CapitalizedWorth, UnavailableMeasures.CapitalizedNeedsPositiveMarr, unavailable);
        double? externalRate = external is double x
            ? Measure(x, UnavailableMeasures.ExternalRate, UnavailableMeasures.BeyondRange, unavailable)
            : Missing(UnavailableMeasures.ExternalRate, UnavailableMeasures.ExternalRateNeedsBoth, unavailable);
        string noPayback = flows.All(f => f == 0.0) ? UnavailableMeasures.NoFlows : UnavailableMeasures.NeverRecovered;
        double? simple = Payback.Simple(flows) ?? Missing(UnavailableMeasures.SimplePayback, noPayback, unavailable);
        double? discounted = Payback.Discounted(flows, i) ?? Missing(UnavailableMeasures.DiscountedPayback, noPayback, unavailable);
        BenefitCostRatio ratio = BenefitCostRatio.Compute(model, i);
        if (ratio.Conventional is null)
        {
            unavailable[UnavailableMeasures.ConventionalRatio] = WhyNoRatio(ratio.ConventionalDenominator);
        }
        if (ratio.Modified is null)
        {
            unavailable[UnavailableMeasures.ModifiedRatio] = WhyNoRatio(ratio.ModifiedDenominator);
        }

        return Outcome.Success(new Evaluation(
            model,
            options.Marr,
            i,
            presentWorth,
            ofNetFlows,
            futureWorth,
            annualWorth,
            periodWorth,
            capitalized,
            rateOfReturn,
            annualRoots,
            externalRate,
            simple,
            discounted,
            ratio)
        {
            Unavailable = unavailable,
        });
    }

    private static double? Measure(double value, string name, string reason, Dictionary<string, string> unavailable) =>
        double.IsFinite(value) ? value : Missing(name, reason, unavailable);

    private static double? Missing(string name, string reason, Dictionary<string, string> unavailable)
    {
        unavailable[name] = reason;
        return null;
    }

    private static string WhyNoRatio(double denominator) =>
        double.IsFinite(denominator) && denominator <= 0.0 ? UnavailableMeasures.DenominatorNotPositive : UnavailableMeasures.BeyondRange;
}
