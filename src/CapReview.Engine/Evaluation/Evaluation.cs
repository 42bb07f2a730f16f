using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;

namespace CapReview.Engine.Evaluation;

/// <summary>
/// Every measure of worth of one model at one MARR. Worths are in money at time 0 (PW), at period n (FW), per year and
/// per period (AW); rates are annual effective unless named per period; payback is in periods and years. A measure
/// that does not exist (no rate of return, never paid back) or cannot be represented (a future worth beyond 1e308) is null,
/// with its reason in <see cref="Unavailable"/>; no figure is ever infinite or NaN.
/// </summary>
public sealed record Evaluation(
    CashFlowModel Model,
    AnnualRate Marr,
    double MarrPerPeriod,
    double PresentWorth,
    double PresentWorthOfNetFlows,
    double? FutureWorth,
    double AnnualWorth,
    double PeriodWorth,
    double? CapitalizedWorth,
    RateOfReturnResult RateOfReturnPerPeriod,
    IReadOnlyList<double> RatesOfReturn,
    double? ExternalRate,
    double? SimplePayback,
    double? DiscountedPayback,
    BenefitCostRatio BenefitCost)
{
    public IReadOnlyList<double> NetFlows => Model.NetFlows;

    /// <summary>Why each null measure is null, keyed by its name in <see cref="UnavailableMeasures"/> (<c>futureWorth</c>, …).</summary>
    public IReadOnlyDictionary<string, string> Unavailable { get; init; } = new Dictionary<string, string>();

    /// <summary>The rate of return when exactly one exists, annual effective.</summary>
    public double? UniqueRateOfReturn => RatesOfReturn.Count == 1 ? RatesOfReturn[0] : null;

    public double? SimplePaybackYears => SimplePayback / Model.PeriodsPerYear;

    public double? DiscountedPaybackYears => DiscountedPayback / Model.PeriodsPerYear;
}
