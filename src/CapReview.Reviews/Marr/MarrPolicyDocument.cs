using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;

namespace CapReview.Reviews.Marr;

/// <summary>
/// The canonical JSON of a MARR policy version (every field that decides a rate, in a fixed order, invariant numbers)
/// and its SHA-256: what a packet cites so that the MARR an approval rests on can be checked later.
/// </summary>
public static class MarrPolicyDocument
{
    public static string Serialize(MarrPolicyVersion policy)
    {
        ArgumentNullException.ThrowIfNull(policy);
        // Inflation and the after-tax MARR are written only when set, so versions made before they existed keep their hash.
        if (policy.InflationRate != 0 || policy.RealMarr || policy.AfterTaxRate is not null)
        {
            return JsonSerializer.Serialize(new
            {
                number = policy.Number,
                rate = policy.Rate.ToString("R", CultureInfo.InvariantCulture),
                basis = policy.Basis.ToString(),
                compoundingsPerYear = policy.CompoundingsPerYear,
                effectiveFrom = policy.EffectiveFrom.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
                lowRiskPremium = policy.LowRiskPremium.ToString("R", CultureInfo.InvariantCulture),
                standardRiskPremium = policy.StandardRiskPremium.ToString("R", CultureInfo.InvariantCulture),
                highRiskPremium = policy.HighRiskPremium.ToString("R", CultureInfo.InvariantCulture),
                inflationRate = policy.InflationRate.ToString("R", CultureInfo.InvariantCulture),
                realMarr = policy.RealMarr,
                afterTaxRate = policy.AfterTaxRate?.ToString("R", CultureInfo.InvariantCulture),
                setBy = policy.SetBy,
                reason = policy.Reason,
            });
        }
        return JsonSerializer.Serialize(new
        {
            number = policy.Number,
            rate = policy.Rate.ToString("R", CultureInfo.InvariantCulture),
            basis = policy.Basis.ToString(),
            compoundingsPerYear = policy.CompoundingsPerYear,
            effectiveFrom = policy.EffectiveFrom.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
            lowRiskPremium = policy.LowRiskPremium.ToString("R", CultureInfo.InvariantCulture),
            standardRiskPremium = policy.StandardRiskPremium.ToString("R", CultureInfo.InvariantCulture),
            highRiskPremium = policy.HighRiskPremium.ToString("R", CultureInfo.InvariantCulture),
            setBy = policy.SetBy,
            reason = policy.Reason,
        });
    }

    public static string Hash(MarrPolicyVersion policy) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(Serialize(policy))));
}
