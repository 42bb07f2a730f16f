using System.Security.Cryptography;
using Microsoft.AspNetCore.Identity;

namespace CapReview.Web.Identity;

/// <summary>
/// A password hash made by the app's own hasher (so as costly to check as any account's) of a random password nobody
/// knows, made once: what <see cref="PasswordSignIn"/> checks a password against when there is no account to check it
/// against.
/// </summary>
public sealed class UnknownAccountHash(IServiceScopeFactory scopes)
{
    private readonly Lazy<string> _hash = new(() =>
    {
        using IServiceScope scope = scopes.CreateScope();
        var hasher = scope.ServiceProvider.GetRequiredService<IPasswordHasher<CapReviewUser>>();
        return hasher.HashPassword(new CapReviewUser(), Convert.ToBase64String(RandomNumberGenerator.GetBytes(32)));
    });

    /// <summary>An account that is nobody's, for the hasher's signature.</summary>
    public CapReviewUser Account { get; } = new();

    public string Hash => _hash.Value;
}
