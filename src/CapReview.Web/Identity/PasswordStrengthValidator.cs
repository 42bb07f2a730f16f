using CapReview.Web.Hosting;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>
/// Refuses a new password that is easy to guess: one of the common passwords or dictionary words in zxcvbn's lists
/// (with the usual substitutions, repeats, sequences and dates), or built on the words of this installation and this
/// person (CapReview, the organisation's name, the user's e-mail and name). Any characters are allowed; there are no
/// composition rules. Checked when a password is set or changed, never at sign-in.
/// </summary>
public sealed class PasswordStrengthValidator(IOptions<OrganisationOptions> organisation) : IPasswordValidator<CapReviewUser>
{
    /// <summary>zxcvbn's score from 0 to 4; 3 is "safely unguessable" against an online attack and a slow offline one.</summary>
    public const int MinimumScore = 3;

    public Task<IdentityResult> ValidateAsync(UserManager<CapReviewUser> manager, CapReviewUser user, string? password)
    {
        ArgumentNullException.ThrowIfNull(user);
        if (string.IsNullOrEmpty(password))
        {
            return Task.FromResult(IdentityResult.Success);
        }
        var result = Zxcvbn.Zxcvbn.MatchPassword(password, ContextWords(user));
        return Task.FromResult(result.Score >= MinimumScore
            ? IdentityResult.Success
            : IdentityResult.Failed(new IdentityError
            {
                Code = "PasswordTooGuessable",
                Description = "This password is too easy to guess (a common password, a word list, a pattern, or the names of this organisation or account). "
                    + "Use a longer phrase of unrelated words.",
            }));
    }

    /// <summary>The words of the installation and of the account, which an attacker would try first.</summary>
    public IReadOnlyList<string> ContextWords(CapReviewUser user)
    {
        ArgumentNullException.ThrowIfNull(user);
        IEnumerable<string> sources = ["capreview", "capital", "review", "budget", organisation.Value.Name, user.Email ?? "", user.UserName ?? "", user.DisplayName];
        return [.. sources.SelectMany(s => s.Split([' ', '.', '@', '-', '_', '+'], StringSplitOptions.RemoveEmptyEntries))
            .Select(w => w.ToLowerInvariant()).Where(w => w.Length >= 3).Distinct()];
    }
}
