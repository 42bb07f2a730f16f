using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace CapReview.Reviews.Audit;

/// <summary>
/// The hash that links an audit event to its predecessor: SHA-256 over the previous hash and every field, each
/// length-prefixed so that no two different events can produce the same input. The first event's predecessor is
/// 64 zeros.
/// </summary>
public static class AuditChain
{
    public const string Genesis = "0000000000000000000000000000000000000000000000000000000000000000";

    public static string HashOf(AuditEvent e, string previousHash)
    {
        ArgumentNullException.ThrowIfNull(e);
        var text = new StringBuilder();
        foreach (string? part in new[]
        {
            previousHash,
            e.At.UtcDateTime.ToString("O", CultureInfo.InvariantCulture),
            e.UserId,
            e.Action,
            e.EntityType,
            e.EntityId,
            e.Before,
            e.After,
        })
        {
            string value = part ?? "\u0000";
            text.Append(value.Length.ToString(CultureInfo.InvariantCulture)).Append(':').Append(value).Append('|');
        }
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text.ToString())));
    }
}
