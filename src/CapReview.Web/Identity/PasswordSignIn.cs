using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// The first step of a browser sign-in, e-mail and password, so that a refusal says nothing about the account: the
/// same words whether the account does not exist, is locked (after failures or by an administrator) or was given a
/// wrong password, and the same work, one password-hash check, in each case. Identity alone would check no hash for
/// an unknown address or a locked account, and answer those faster.
/// </summary>
public sealed class PasswordSignIn(UserManager<CapReviewUser> users, SignInManager<CapReviewUser> signIn, IPasswordHasher<CapReviewUser> hasher, UnknownAccountHash unknown)
{
    /// <summary>The one answer to every refused password sign-in.</summary>
    public const string Refusal = "The email or the password is not right, or the account is locked (for 10 minutes after 8 failed attempts, or by an administrator).";

    /// <summary>The account the e-mail names (null when there is none), and Identity's verdict.</summary>
    public async Task<(CapReviewUser? User, SignInResult Result)> SignInAsync(string email, string password)
    {
        ArgumentNullException.ThrowIfNull(email);
        ArgumentNullException.ThrowIfNull(password);
        CapReviewUser? user = await users.FindByEmailAsync(email.Trim()).ConfigureAwait(false);
        if (user is null || await users.IsLockedOutAsync(user).ConfigureAwait(false))
        {
            // The check a real password gets, against a hash of the same strength; its answer does not matter.
            hasher.VerifyHashedPassword(user ?? unknown.Account, unknown.Hash, password);
            return (user, user is null ? SignInResult.Failed : SignInResult.LockedOut);
        }
        return (user, await signIn.PasswordSignInAsync(user, password, isPersistent: false, lockoutOnFailure: true).ConfigureAwait(false));
    }
}
