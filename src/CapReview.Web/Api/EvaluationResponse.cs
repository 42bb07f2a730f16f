using CapReview.Engine.Evaluation;

namespace CapReview.Web.Api;

/// <summary>
/// The measures of one model at one MARR. Money in the model's units; rates annual effective as fractions. A measure
/// that does not exist or that no number can hold is null, and <c>unavailable</c> says why, keyed by its name.
/// </summary>
public sealed record EvaluationResponse(
    double PresentWorth,
    double? FutureWorth,
    double AnnualWorth,
    double PeriodWorth,
    double? CapitalizedWorth,
    double MarrEffectiveAnnual,
    double MarrPerPeriod,
    RateOfReturnResponse RateOfReturn,
    double? ExternalRate,
    PaybackResponse Payback,
    BenefitCostResponse BenefitCostRatio,
    IReadOnlyList<double> NetFlows,
    IReadOnlyDictionary<string, string> Unavailable)
{
    /// <summary>The after-tax figures when the request carried a <c>tax</c> block; absent otherwise.</summary>
    [System.Text.Json.Serialization.JsonIgnore(Condition = System.Text.Json.Serialization.JsonIgnoreCondition.WhenWritingNull)]
    public AfterTaxResponse? AfterTax { get; init; }

    public static EvaluationResponse From(Evaluation evaluation)
    {
        ArgumentNullException.ThrowIfNull(evaluation);
        var ror = evaluation.RateOfReturnPerPeriod;
        return new EvaluationResponse(
            evaluation.PresentWorth,
            evaluation.FutureWorth,
            evaluation.AnnualWorth,
            evaluation.PeriodWorth,
            evaluation.CapitalizedWorth,
            evaluation.Marr.EffectiveAnnual(),
            evaluation.MarrPerPeriod,
            new RateOfReturnResponse(evaluation.RatesOfReturn, ror.SignChanges, ror.Roots.Count == 1, ror.Kind.ToString().ToLowerInvariant(), ror.CumulativeSignChanges, ror.CumulativeTestPassed),
            evaluation.ExternalRate,
            new PaybackResponse(evaluation.SimplePayback, evaluation.DiscountedPayback, evaluation.SimplePaybackYears, evaluation.DiscountedPaybackYears),
            new BenefitCostResponse(evaluation.BenefitCost.Conventional, evaluation.BenefitCost.Modified),
            evaluation.NetFlows,
            evaluation.Unavailable);
    }
}

/// <param name="Roots">Every rate of return found in (−100%, 1000%], annual effective, ascending.</param>
/// <param name="SignChanges">Sign changes in the net flows (Descartes' bound on the number of roots).</param>
/// <param name="Unique">True when exactly one root exists.</param>
/// <param name="Kind">none, unique or several.</param>
/// <param name="CumulativeSignChanges">Sign changes in the cumulative net flows.</param>
/// <param name="CumulativeTestPassed">Norström's test: the cumulative flows start negative and change sign once.</param>
public sealed record RateOfReturnResponse(IReadOnlyList<double> Roots, int SignChanges, bool Unique, string Kind, int CumulativeSignChanges, bool CumulativeTestPassed);

/// <param name="Simple">Periods until the undiscounted flows recover the investment; null when never.</param>
/// <param name="Discounted">Periods until the flows discounted at the MARR recover it; null when never.</param>
/// <param name="SimpleYears">The simple payback in years.</param>
/// <param name="DiscountedYears">The discounted payback in years.</param>
public sealed record PaybackResponse(double? Simple, double? Discounted, double? SimpleYears, double? DiscountedYears);

/// <param name="Conventional">B / (I − S + O); null when the denominator is not positive.</param>
/// <param name="Modified">(B − O) / (I − S); null when the denominator is not positive.</param>
public sealed record BenefitCostResponse(double? Conventional, double? Modified);
