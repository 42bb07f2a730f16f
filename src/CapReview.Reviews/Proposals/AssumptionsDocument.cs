using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// The canonical JSON form of <see cref="ProposalAssumptions"/>: camelCase names in declaration order, enums as
/// camelCase strings, nulls omitted, no whitespace. The same assumptions always give the same text and so the same
/// SHA-256, which is what a decision and a packet cite.
/// </summary>
public static class AssumptionsDocument
{
    private static readonly JsonSerializerOptions Canonical = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = false,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
        Converters = { new JsonStringEnumConverter(JsonNamingPolicy.CamelCase, allowIntegerValues: false) },
    };

    public static string Serialize(ProposalAssumptions assumptions) => JsonSerializer.Serialize(assumptions, Canonical);

    public static ProposalAssumptions Deserialize(string json) =>
        JsonSerializer.Deserialize<ProposalAssumptions>(json, Canonical)
        ?? throw new InvalidOperationException("A stored version holds no assumptions.");

    /// <summary>Lower-case hex SHA-256 of the UTF-8 text.</summary>
    public static string Hash(string canonicalJson) =>
        Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(canonicalJson)));
}
