using CapReview.Engine.Rates;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Marr;

/// <summary>
/// One version of the organisation's MARR: the rate with its basis, from when it applies, premiums per risk class
/// (effective annual points added to the base), who set it and why. Versions are only ever added.
/// </summary>
public sealed class MarrPolicyVersion
{
    private MarrPolicyVersion()
    {
    }

    /// <summary>Version <paramref name="number"/> of the policy, as <paramref name="setBy"/> entered it; a rate that is not nominal is compounded once a year.</summary>
    public MarrPolicyVersion(int number, NewMarrPolicy policy, string setBy, DateTimeOffset createdAt)
    {
        ArgumentNullException.ThrowIfNull(policy);
        Number = number;
        Rate = policy.Rate;
        Basis = policy.Basis;
        CompoundingsPerYear = policy.Basis == RateBasis.Nominal ? policy.CompoundingsPerYear : 1;
        EffectiveFrom = policy.EffectiveFrom;
        LowRiskPremium = policy.LowRiskPremium;
        StandardRiskPremium = policy.StandardRiskPremium;
        HighRiskPremium = policy.HighRiskPremium;
        InflationRate = policy.InflationRate;
        RealMarr = policy.RealMarr;
        AfterTaxRate = policy.AfterTaxRate;
        SetBy = setBy;
        Reason = policy.Reason;
        CreatedAt = createdAt;
    }

    public int Id { get; private set; }

    public int Number { get; private set; }

    public double Rate { get; private set; }

    public RateBasis Basis { get; private set; }

    /// <summary>m for a nominal rate.</summary>
    public int CompoundingsPerYear { get; private set; } = 1;

    public DateOnly EffectiveFrom { get; private set; }

    public double LowRiskPremium { get; private set; }

    public double StandardRiskPremium { get; private set; }

    public double HighRiskPremium { get; private set; }

    /// <summary>General inflation a year, applied to proposal amounts given in constant money.</summary>
    public double InflationRate { get; private set; }

    /// <summary>Whether <see cref="Rate"/> is a real (inflation-free) MARR; the market MARR is then (1 + real)(1 + inflation) − 1.</summary>
    public bool RealMarr { get; private set; }

    /// <summary>The after-tax MARR (effective annual); null for the MARR times (1 − the proposal's tax rate).</summary>
    public double? AfterTaxRate { get; private set; }

    public string SetBy { get; private set; } = "";

    public string Reason { get; private set; } = "";

    public DateTimeOffset CreatedAt { get; private set; }

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
