using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>Authenticates <c>Authorization: Bearer crv_…</c> with a personal API token.</summary>
public sealed class ApiTokenAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options,
    ILoggerFactory logger,
    UrlEncoder encoder,
    ApiTokenService tokens,
    UserManager<CapReviewUser> users,
    IUserClaimsPrincipalFactory<CapReviewUser> principals)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "ApiToken";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        string? header = Request.Headers.Authorization;
        if (header is null || !header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase))
        {
            return AuthenticateResult.NoResult();
        }
        string? userId = await tokens.FindUserAsync(header["Bearer ".Length..].Trim(), Context.RequestAborted).ConfigureAwait(false);
        CapReviewUser? user = userId is null ? null : await users.FindByIdAsync(userId).ConfigureAwait(false);
        if (user is null || (user.LockoutEnd is { } end && end > DateTimeOffset.UtcNow))
        {
            return AuthenticateResult.Fail("The API token is not valid.");
        }
        var principal = await principals.CreateAsync(user).ConfigureAwait(false);
        return AuthenticateResult.Success(new AuthenticationTicket(principal, SchemeName));
    }

    /// <summary>Challenges only a request that presented a token; otherwise the sign-in cookie's rules answer.</summary>
    protected override Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        string? header = Request.Headers.Authorization;
        return header is not null && header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase)
            ? base.HandleChallengeAsync(properties)
            : Task.CompletedTask;
    }
}
