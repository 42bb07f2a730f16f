using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;

namespace CapReview.Engine.Evaluation;

/// <summary>Computes every measure of worth of a validated model at a MARR.</summary>
public static class ModelEvaluator
{
    public static Evaluation Evaluate(CashFlowModel model, EvaluationOptions options)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(options);
        int p = model.PeriodsPerYear;
        int n = model.Horizon;
        double i = options.Marr.EffectivePerPeriod(p);

        double presentWorth = model.ClosedFormPresentWorth(i);
        double[] flows = [.. model.NetFlows];
        double periodWorth = presentWorth * CompoundInterest.CapitalRecovery(i, n);
        // A uniform amount each period is worth (F/A, i, p) times as much at each year end.
        double annualWorth = periodWorth * CompoundInterest.UniformSeriesCompoundAmount(i, p);

        double lowest = AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.LowestAnnual, p);
        double highest = AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.HighestAnnual, p);
        RateOfReturnResult rateOfReturn = RateOfReturnSearch.Find(flows, lowest, highest);
        double[] annualRoots = [.. rateOfReturn.Roots.Select(r => AnnualRate.AnnualEffectiveFromPeriod(r, p))];

        double finance = (options.FinanceRate ?? options.Marr).EffectivePerPeriod(p);
        double reinvestment = (options.ReinvestmentRate ?? options.Marr).EffectivePerPeriod(p);
        double? external = ExternalRateOfReturn.Compute(flows, finance, reinvestment);

        return new Evaluation(
            model,
            options.Marr,
            i,
            presentWorth,
            FlowWorth.PresentWorth(flows, i),
            Finite(presentWorth * CompoundInterest.SinglePaymentCompoundAmount(i, n)),
            annualWorth,
            periodWorth,
            i > 0.0 ? periodWorth / i : null,
            rateOfReturn,
            annualRoots,
            external is double e ? AnnualRate.AnnualEffectiveFromPeriod(e, p) : null,
            Payback.Simple(flows),
            Payback.Discounted(flows, i),
            BenefitCostRatio.Compute(model, i));
    }

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
