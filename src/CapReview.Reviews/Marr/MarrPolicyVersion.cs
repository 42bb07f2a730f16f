using CapReview.Engine.Rates;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Marr;

/// <summary>
/// One version of the organisation's MARR: the rate with its basis, from when it applies, premiums per risk class
/// (effective annual points added to the base), who set it and why. Versions are only ever added.
/// </summary>
public sealed class MarrPolicyVersion
{
    public int Id { get; set; }

    public int Number { get; set; }

    public double Rate { get; set; }

    public RateBasis Basis { get; set; }

    /// <summary>m for a nominal rate.</summary>
    public int CompoundingsPerYear { get; set; } = 1;

    public DateOnly EffectiveFrom { get; set; }

    public double LowRiskPremium { get; set; }

    public double StandardRiskPremium { get; set; }

    public double HighRiskPremium { get; set; }

    /// <summary>General inflation a year, applied to proposal amounts given in constant money.</summary>
    public double InflationRate { get; set; }

    /// <summary>Whether <see cref="Rate"/> is a real (inflation-free) MARR; the market MARR is then (1 + real)(1 + inflation) − 1.</summary>
    public bool RealMarr { get; set; }

    /// <summary>The after-tax MARR (effective annual); null for the MARR times (1 − the proposal's tax rate).</summary>
    public double? AfterTaxRate { get; set; }

    public required string SetBy { get; set; }

    public required string Reason { get; set; }

    public DateTimeOffset CreatedAt { get; set; }

    /// <summary>The base rate as quoted.</summary>
    public AnnualRate BaseRate() => AnnualRate.Create(Rate, Basis, CompoundingsPerYear);

    /// <summary>The MARR for a risk class: the base rate's effective annual equivalent plus the class's premium.</summary>
    public AnnualRate RateFor(RiskClass riskClass)
    {
        double premium = riskClass switch
        {
            RiskClass.Low => LowRiskPremium,
            RiskClass.High => HighRiskPremium,
            _ => StandardRiskPremium,
        };
        return premium == 0.0 ? BaseRate() : AnnualRate.Effective(BaseRate().EffectiveAnnual() + premium);
    }
}
