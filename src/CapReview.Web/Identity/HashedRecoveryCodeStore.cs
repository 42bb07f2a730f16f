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
    public override Task ReplaceCodesAsync(CapReviewUser user, IEnumerable<string> recoveryCodes, CancellationToken cancellationToken = default) =>
        base.ReplaceCodesAsync(user, recoveryCodes.Select(Hash), cancellationToken);

    public override Task<bool> RedeemCodeAsync(CapReviewUser user, string code, CancellationToken cancellationToken = default) =>
        base.RedeemCodeAsync(user, Hash(code), cancellationToken);

    /// <summary>The hash of a code as typed: case, spaces and hyphens do not matter.</summary>
    public static string Hash(string code)
    {
        string canonical = new([.. (code ?? "").ToUpperInvariant().Where(char.IsAsciiLetterOrDigit)]);
        return Convert.ToHexStringLower(SHA256.HashData(Encoding.ASCII.GetBytes(canonical)));
    }
}
