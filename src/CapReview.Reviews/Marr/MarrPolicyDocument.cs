using System.Globalization;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json.Nodes;

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
        var document = new JsonObject
        {
            ["number"] = policy.Number,
            ["rate"] = Invariant(policy.Rate),
            ["basis"] = policy.Basis.ToString(),
            ["compoundingsPerYear"] = policy.CompoundingsPerYear,
            ["effectiveFrom"] = policy.EffectiveFrom.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture),
            ["lowRiskPremium"] = Invariant(policy.LowRiskPremium),
            ["standardRiskPremium"] = Invariant(policy.StandardRiskPremium),
            ["highRiskPremium"] = Invariant(policy.HighRiskPremium),
        };
        // Inflation and the after-tax MARR are written only when set, so versions made before they existed keep their hash.
        if (policy.InflationRate != 0 || policy.RealMarr || policy.AfterTaxRate is not null)
        {
            document["inflationRate"] = Invariant(policy.InflationRate);
            document["realMarr"] = policy.RealMarr;
            document["afterTaxRate"] = policy.AfterTaxRate is double afterTax ? Invariant(afterTax) : null;
        }
        document["setBy"] = policy.SetBy;
        document["reason"] = policy.Reason;
        return document.ToJsonString();
    }

    public static string Hash(MarrPolicyVersion policy) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(Serialize(policy))));

    private static string Invariant(double value) => value.ToString("R", CultureInfo.InvariantCulture);
}
