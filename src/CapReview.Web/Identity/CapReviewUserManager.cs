using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>
/// Identity's user manager with longer recovery codes: 25 symbols from a 32-letter alphabet without look-alikes
/// (125 random bits, in groups of five), so that a stored SHA-256 hash of one cannot be reversed by trying them all.
/// </summary>
public sealed class CapReviewUserManager(
    IUserStore<CapReviewUser> store,
    IOptions<IdentityOptions> optionsAccessor,
    IPasswordHasher<CapReviewUser> passwordHasher,
    IEnumerable<IUserValidator<CapReviewUser>> userValidators,
    IEnumerable<IPasswordValidator<CapReviewUser>> passwordValidators,
    ILookupNormalizer keyNormalizer,
    IdentityErrorDescriber errors,
    IServiceProvider services,
    ILogger<UserManager<CapReviewUser>> logger)
    : UserManager<CapReviewUser>(store, optionsAccessor, passwordHasher, userValidators, passwordValidators, keyNormalizer, errors, services, logger)
{
    private const string Alphabet = "ABCDEFGHJKLMNPQRSTUVWXYZ23456789";

    protected override string CreateTwoFactorRecoveryCode() =>
        string.Join('-', RandomNumberGenerator.GetString(Alphabet, 25).Chunk(5).Select(group => new string(group)));
}
