using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Marr;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// A version's assumptions under a MARR policy, as the board evaluates them: the proposal's own MARR or the policy's
/// for its risk class, the policy's general inflation and kind of MARR (real or market), and the policy's after-tax
/// MARR unless the proposal states its own.
/// </summary>
public static class ProposalTerms
{
    /// <summary>The MARR as quoted: the override's rate, or the policy's for the risk class (none before the first policy).</summary>
    public static AnnualRate QuotedMarr(ProposalAssumptions assumptions, MarrPolicyVersion? policy, RiskClass risk)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        return assumptions.MarrOverride is { Rate: var own }
            ? AnnualRate.Create(own.Value ?? double.NaN, own.Basis ?? RateBasis.Effective, own.CompoundingsPerYear ?? 1)
            : policy?.RateFor(risk) ?? throw new Common.RuleViolationException("There is no MARR policy yet.");
    }

    public static ModelSpec Model(ProposalAssumptions assumptions, MarrPolicyVersion policy, RiskClass risk)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        ArgumentNullException.ThrowIfNull(policy);
        RateSpec rate = assumptions.MarrOverride?.Rate ?? Spec(policy.RateFor(risk));
        bool inflationSet = policy.InflationRate != 0 || policy.RealMarr;
        return assumptions.Model with
        {
            Rate = rate,
            Inflation = inflationSet
                ? new InflationSpec { Rate = policy.InflationRate, BaseYear = assumptions.Model.Inflation?.BaseYear, RealMarr = policy.RealMarr }
                : assumptions.Model.Inflation,
        };
    }

    /// <summary>The version's tax settings with the policy's after-tax MARR when it states none; null before tax.</summary>
    public static TaxSpec? Tax(ProposalAssumptions assumptions, MarrPolicyVersion policy)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        ArgumentNullException.ThrowIfNull(policy);
        if (assumptions.Tax is not { } tax)
        {
            return null;
        }
        return tax.AfterTaxMarr is null && policy.AfterTaxRate is double afterTax
            ? tax with { AfterTaxMarr = new RateSpec { Value = afterTax, Basis = RateBasis.Effective } }
            : tax;
    }

    private static RateSpec Spec(AnnualRate rate) => new()
    {
        Value = rate.Value,
        Basis = rate.Basis,
        CompoundingsPerYear = rate.Basis == RateBasis.Nominal ? rate.CompoundingsPerYear : null,
    };
}
