using System.Text.Encodings.Web;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace CapReview.Web.Identity;

/// <summary>Authenticates <c>Authorization: Bearer crv_…</c> with a personal API token (its user remembered briefly: <see cref="ApiTokenCache"/>).</summary>
public sealed class ApiTokenAuthenticationHandler(
    IOptionsMonitor<AuthenticationSchemeOptions> options,
    ILoggerFactory logger,
    UrlEncoder encoder,
    ApiTokenService tokens,
    UserManager<CapReviewUser> users,
    IUserClaimsPrincipalFactory<CapReviewUser> principals,
    ApiTokenCache cache)
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
        string token = header["Bearer ".Length..].Trim();
        string key = ApiTokenService.Hash(token);
        if (!cache.TryGet(key, out System.Security.Claims.ClaimsPrincipal? principal))
        {
            string? userId = await tokens.FindUserAsync(token, Context.RequestAborted).ConfigureAwait(false);
            CapReviewUser? user = userId is null ? null : await users.FindByIdAsync(userId).ConfigureAwait(false);
            principal = user is null || (user.LockoutEnd is { } end && end > DateTimeOffset.UtcNow)
                ? null
                : await principals.CreateAsync(user).ConfigureAwait(false);
            cache.Remember(key, principal);
        }
        return principal is null
            ? AuthenticateResult.Fail("The API token is not valid.")
            : AuthenticateResult.Success(new AuthenticationTicket(principal.Clone(), SchemeName));
    }

    /// <summary>Challenges only a request that presented a token; otherwise the sign-in cookie's rules answer.</summary>
    protected override Task HandleChallengeAsync(AuthenticationProperties properties) =>
        PresentsToken(Request) ? base.HandleChallengeAsync(properties) : Task.CompletedTask;

    /// <summary>Refuses only a request that presented a token (403); a browser's is sent to the not-for-your-role page by the cookie's rules.</summary>
    protected override Task HandleForbiddenAsync(AuthenticationProperties properties) =>
        PresentsToken(Request) ? base.HandleForbiddenAsync(properties) : Task.CompletedTask;

    /// <summary>Whether the request carries an API token in its Authorization header.</summary>
    public static bool PresentsToken(HttpRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        string? header = request.Headers.Authorization;
        return header is not null && header.StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase);
    }
}
