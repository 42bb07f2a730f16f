using System.Security.Cryptography;
using System.Text;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>Issues, finds and revokes personal API tokens; only hashes are stored.</summary>
public sealed class ApiTokenService(IDbContextFactory<CapReviewIdentityDbContext> contexts, TimeProvider clock)
{
    private const string Prefix = "crv_";

    /// <summary>A new token for the user; the returned text is the only copy.</summary>
    public async Task<string> IssueAsync(string userId, string name, CancellationToken cancellationToken)
    {
        string token = Prefix + Base64Url(RandomNumberGenerator.GetBytes(32));
        await using var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        db.ApiTokens.Add(new ApiToken { UserId = userId, Name = name, TokenHash = Hash(token), CreatedAt = clock.GetUtcNow() });
        await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
        return token;
    }

    /// <summary>The user id of a valid, unrevoked token, or null.</summary>
    public async Task<string?> FindUserAsync(string token, CancellationToken cancellationToken)
    {
        if (!token.StartsWith(Prefix, StringComparison.Ordinal) || token.Length > 100)
        {
            return null;
        }
        string hash = Hash(token);
        await using var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        return await db.ApiTokens.Where(t => t.TokenHash == hash && t.RevokedAt == null).Select(t => t.UserId)
            .SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Revokes every token of the user (kept, marked with the time); how many were still valid.</summary>
    public async Task<int> RevokeAllAsync(string userId, CancellationToken cancellationToken)
    {
        await using var db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        return await db.ApiTokens.Where(t => t.UserId == userId && t.RevokedAt == null)
            .ExecuteUpdateAsync(t => t.SetProperty(x => x.RevokedAt, clock.GetUtcNow()), cancellationToken).ConfigureAwait(false);
    }

    public static string Hash(string token) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(token)));

    private static string Base64Url(byte[] bytes) => Convert.ToBase64String(bytes).TrimEnd('=').Replace('+', '-').Replace('/', '_');
}
