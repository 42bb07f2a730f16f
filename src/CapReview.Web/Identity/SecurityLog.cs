using System.Security.Claims;

namespace CapReview.Web.Identity;

/// <summary>
/// The security events an operator watches, in the log category CapReview.Security (docs/security.md, logging):
/// sign-ins that succeed or fail and why, lockouts, sign-outs, refused API tokens, and refused access. Who is named by
/// account id; what a visitor typed (an e-mail that may be a mistyped password) and secrets are never logged.
/// </summary>
public static partial class SecurityLog
{
    public const string Category = "CapReview.Security";

    [LoggerMessage(EventId = 100, Level = LogLevel.Information, Message = "Signed in: user {UserId} with {Method} from {Address}.")]
    public static partial void SignedIn(ILogger logger, string userId, string method, string? address);

    [LoggerMessage(EventId = 101, Level = LogLevel.Warning, Message = "Sign-in refused ({Reason}) for {UserId} from {Address}.")]
    public static partial void SignInRefused(ILogger logger, string reason, string userId, string? address);

    [LoggerMessage(EventId = 102, Level = LogLevel.Warning, Message = "Account {UserId} is locked after repeated failed sign-ins (from {Address}).")]
    public static partial void LockedOut(ILogger logger, string userId, string? address);

    [LoggerMessage(EventId = 103, Level = LogLevel.Information, Message = "Signed out: user {UserId}; the account's sessions end everywhere.")]
    public static partial void SignedOut(ILogger logger, string userId);

    [LoggerMessage(EventId = 104, Level = LogLevel.Information, Message = "Password changed by user {UserId}; the account's other sessions end.")]
    public static partial void PasswordChanged(ILogger logger, string userId);

    [LoggerMessage(EventId = 110, Level = LogLevel.Warning, Message = "Refused {Status} for {Method} {Path}: user {UserId} from {Address}.")]
    public static partial void Refused(ILogger logger, int status, string method, string path, string userId, string? address);

    /// <summary>
    /// Logs every 403; every 401 to a request that presented credentials (an unknown or revoked API token); every 429
    /// (a rate limit reached); and every form post refused with 400 (a form without its antiforgery token: a forged post).
    /// </summary>
    public static IApplicationBuilder UseSecurityLog(this IApplicationBuilder app)
    {
        ArgumentNullException.ThrowIfNull(app);
        ILogger log = app.ApplicationServices.GetRequiredService<ILoggerFactory>().CreateLogger(Category);
        return app.Use(async (context, next) =>
        {
            context.Response.OnStarting(() =>
            {
                int status = context.Response.StatusCode;
                bool refused = status switch
                {
                    StatusCodes.Status403Forbidden or StatusCodes.Status429TooManyRequests => true,
                    StatusCodes.Status401Unauthorized => context.Request.Headers.Authorization.Count > 0,
                    // The content type as sent: the form itself may not be read once its antiforgery check failed.
                    StatusCodes.Status400BadRequest => HttpMethods.IsPost(context.Request.Method)
                        && (context.Request.ContentType?.StartsWith("application/x-www-form-urlencoded", StringComparison.OrdinalIgnoreCase) == true
                            || context.Request.ContentType?.StartsWith("multipart/form-data", StringComparison.OrdinalIgnoreCase) == true),
                    _ => false,
                };
                if (refused)
                {
                    Refused(log, status, context.Request.Method, context.Request.Path, UserOf(context.User), Address(context));
                }
                return Task.CompletedTask;
            });
            await next(context).ConfigureAwait(false);
        });
    }

    public static string UserOf(ClaimsPrincipal? user) => user?.FindFirstValue(ClaimTypes.NameIdentifier) ?? "anonymous";

    public static string? Address(HttpContext? context) => context?.Connection.RemoteIpAddress?.ToString();
}
