using System.Security.Claims;
using Microsoft.Extensions.Caching.Memory;

namespace CapReview.Web.Identity;

/// <summary>
/// The users API tokens stand for, kept for <see cref="Remembered"/> so that a busy client costs no database reads per
/// request; a revoked token or a locked or changed account takes effect within that time on every server. Refusals are
/// kept too, so that a flood of bad tokens is not a flood of queries; the cache is bounded so made-up tokens cannot grow it.
/// </summary>
public sealed class ApiTokenCache : IDisposable
{
    public static readonly TimeSpan Remembered = TimeSpan.FromSeconds(30);

    private readonly MemoryCache _cache = new(new MemoryCacheOptions { SizeLimit = 100_000 });

    public bool TryGet(string tokenHash, out ClaimsPrincipal? principal) => _cache.TryGetValue(tokenHash, out principal);

    public void Remember(string tokenHash, ClaimsPrincipal? principal) =>
        _cache.Set(tokenHash, principal, new MemoryCacheEntryOptions { AbsoluteExpirationRelativeToNow = Remembered, Size = 1 });

    /// <summary>Forgets everything, so that a revocation or a disabled account is refused at once on this server.</summary>
    public void Forget() => _cache.Clear();

    public void Dispose() => _cache.Dispose();
}
