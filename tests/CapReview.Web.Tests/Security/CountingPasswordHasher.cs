using System.Collections.Concurrent;
using CapReview.Web.Identity;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Tests.Security;

/// <summary>Identity's own password hasher, noting every hash it is asked to verify a password against.</summary>
public sealed class CountingPasswordHasher(IOptions<PasswordHasherOptions> options) : IPasswordHasher<CapReviewUser>
{
    private readonly PasswordHasher<CapReviewUser> _inner = new(options);

    public ConcurrentQueue<string> Verified { get; } = new();

    public string HashPassword(CapReviewUser user, string password) => _inner.HashPassword(user, password);

    public PasswordVerificationResult VerifyHashedPassword(CapReviewUser user, string hashedPassword, string providedPassword)
    {
        Verified.Enqueue(hashedPassword);
        return _inner.VerifyHashedPassword(user, hashedPassword, providedPassword);
    }
}
