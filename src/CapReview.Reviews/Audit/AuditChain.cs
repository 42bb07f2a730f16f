using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace CapReview.Reviews.Audit;

/// <summary>
/// The hash that links an audit event to its predecessor, over the previous hash and every field, each length-prefixed
/// so that no two different events give the same input. Keyed events (<see cref="AuditEvent.KeyId"/>) take an
/// HMAC-SHA256 with a secret kept outside the database and include the key's id; events written before the chain was
/// keyed kept a plain SHA-256, which anyone can recompute. The first event's predecessor is 64 zeros.
/// </summary>
public static class AuditChain
{
    public const string Genesis = "0000000000000000000000000000000000000000000000000000000000000000";

    /// <summary>The plain SHA-256 of an event written before the chain was keyed.</summary>
    public static string HashOf(AuditEvent e, string previousHash) =>
        Convert.ToHexStringLower(SHA256.HashData(Input(e, previousHash, keyId: null)));

    /// <summary>The HMAC-SHA256 of a keyed event.</summary>
    public static string HashOf(AuditEvent e, string previousHash, AuditKey key)
    {
        ArgumentNullException.ThrowIfNull(key);
        return Convert.ToHexStringLower(HMACSHA256.HashData(key.Secret, Input(e, previousHash, key.Id)));
    }

    private static byte[] Input(AuditEvent e, string previousHash, string? keyId)
    {
        ArgumentNullException.ThrowIfNull(e);
        var text = new StringBuilder();
        var parts = new List<string?>
        {
            previousHash,
            e.At.UtcDateTime.ToString("O", CultureInfo.InvariantCulture),
            e.UserId,
            e.Action,
            e.EntityType,
            e.EntityId,
            e.Before,
            e.After,
        };
        if (keyId is not null)
        {
            parts.Add(keyId);
        }
        foreach (string? part in parts)
        {
            string value = part ?? "\u0000";
            text.Append(value.Length.ToString(CultureInfo.InvariantCulture)).Append(':').Append(value).Append('|');
        }
        return Encoding.UTF8.GetBytes(text.ToString());
    }
}
