using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Identity.EntityFrameworkCore;

namespace CapReview.Web.Identity;

/// <summary>
/// Identity's store with the recovery codes kept as SHA-256 hashes rather than as they are shown: someone who reads
/// the database cannot use them. A plain hash suffices because each code carries 125 random bits (<see cref="CapReviewUserManager"/>).
/// </summary>
public sealed class HashedRecoveryCodeStore(CapReviewIdentityDbContext context, IdentityErrorDescriber? describer = null)
    : UserStore<CapReviewUser, IdentityRole, CapReviewIdentityDbContext>(context, describer)
{
    // Where Identity's store keeps the codes: a user token of its own provider (UserStoreBase's private names).
    private const string InternalLoginProvider = "[AspNetUserStore]";
    private const string RecoveryCodeTokenName = "RecoveryCodes";

    public override Task ReplaceCodesAsync(CapReviewUser user, IEnumerable<string> recoveryCodes, CancellationToken cancellationToken = default) =>
        base.ReplaceCodesAsync(user, recoveryCodes.Select(Hash), cancellationToken);

    /// <summary>
    /// Uses up one code: the stored hashes without the one that matches are written back as they are. (Identity's own
    /// redemption writes them back through <see cref="ReplaceCodesAsync"/>, which would hash the hashes and so make
    /// every remaining code useless.)
    /// </summary>
    public override async Task<bool> RedeemCodeAsync(CapReviewUser user, string code, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(user);
        string stored = await GetTokenAsync(user, InternalLoginProvider, RecoveryCodeTokenName, cancellationToken).ConfigureAwait(false) ?? "";
        string[] hashes = stored.Split(';', StringSplitOptions.RemoveEmptyEntries);
        string hash = Hash(code);
        if (!hashes.Contains(hash, StringComparer.Ordinal))
        {
            return false;
        }
        await base.ReplaceCodesAsync(user, hashes.Where(h => !string.Equals(h, hash, StringComparison.Ordinal)), cancellationToken).ConfigureAwait(false);
        return true;
    }

    /// <summary>The hash of a code as typed: case, spaces and hyphens do not matter.</summary>
    public static string Hash(string code)
    {
        string canonical = new([.. (code ?? "").ToUpperInvariant().Where(char.IsAsciiLetterOrDigit)]);
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.ASCII.GetBytes(canonical)));
    }
}
