using System.Security.Cryptography;

namespace CapReview.Reviews.Audit;

/// <summary>One secret that keys the audit chain, named by the id each event it keyed records.</summary>
public sealed record AuditKey(string Id, byte[] Secret);

/// <summary>
/// The secrets that key the audit chain, kept outside the database (configuration or a key file), so that someone who
/// can write to the database cannot recompute the chain after changing it. New events are keyed with
/// <see cref="Current"/>; older keys stay in the ring to verify the events they keyed (rotation).
/// </summary>
public sealed class AuditKeyRing
{
    /// <summary>HMAC-SHA256's own block: a shorter secret is weaker than the hash (RFC 2104, section 3).</summary>
    public const int MinimumSecretBytes = 32;

    private readonly Lazy<(Dictionary<string, AuditKey> Keys, AuditKey Current)> _ring;

    public AuditKeyRing(IEnumerable<AuditKey> keys, string currentId)
    {
        ArgumentNullException.ThrowIfNull(keys);
        var ring = Check(keys, currentId);
        _ring = new(() => ring);
    }

    private AuditKeyRing(Func<(IReadOnlyList<AuditKey> Keys, string CurrentId)> load) =>
        _ring = new(() =>
        {
            var (keys, currentId) = load();
            return Check(keys, currentId);
        }, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>
    /// A ring read when first needed (the first event written or verified), so that a key file beside a database
    /// that is not there yet is neither read nor made before the database is.
    /// </summary>
    public static AuditKeyRing Deferred(Func<(IReadOnlyList<AuditKey> Keys, string CurrentId)> load) => new(load);

    public AuditKey Current => _ring.Value.Current;

    public AuditKey? Find(string id) => _ring.Value.Keys.GetValueOrDefault(id);

    /// <summary>A ring with one random key that lives as long as the process: for tests, never for an installation.</summary>
    public static AuditKeyRing Ephemeral() => new([new AuditKey("ephemeral", RandomNumberGenerator.GetBytes(MinimumSecretBytes))], "ephemeral");

    private static (Dictionary<string, AuditKey>, AuditKey) Check(IEnumerable<AuditKey> keys, string currentId)
    {
        var byId = keys.ToDictionary(k => k.Id, StringComparer.Ordinal);
        foreach (AuditKey key in byId.Values)
        {
            if (key.Id.Length is 0 or > 40 || key.Id.Contains(' ', StringComparison.Ordinal) || key.Secret.Length < MinimumSecretBytes)
            {
                throw new InvalidOperationException($"Audit key '{key.Id}': an id of 1 to 40 characters without spaces and a secret of at least {MinimumSecretBytes} bytes.");
            }
        }
        return byId.TryGetValue(currentId, out AuditKey? current) ? (byId, current)
            : throw new InvalidOperationException($"The current audit key '{currentId}' is not among the keys.");
    }
}
