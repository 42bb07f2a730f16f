using Microsoft.Data.Sqlite;
using Npgsql;

namespace CapReview.Web.Operations;

/// <summary>
/// The plain 503 a visitor gets while the database cannot be used: every request but the probes before the database
/// was first prepared, and any request whose database work fails because the database went away while the app ran
/// (the server down or refusing connections, the file gone, the disk full). The request changed nothing: each piece of
/// work is one transaction. Readiness fails meanwhile (<see cref="DatabaseHealthCheck"/>); nothing needs restarting.
/// </summary>
public static partial class DatabaseGate
{
    private const string Message = "CapReview cannot reach its database at the moment. This request changed nothing and nothing stored has been lost; "
        + "the administrators can see why in the log. Try again in a minute.";

    public static IApplicationBuilder UseDatabaseGate(this IApplicationBuilder app)
    {
        ArgumentNullException.ThrowIfNull(app);
        var preparation = app.ApplicationServices.GetRequiredService<DatabasePreparation>();
        ILogger log = app.ApplicationServices.GetRequiredService<ILoggerFactory>().CreateLogger(typeof(DatabaseGate).FullName!);
        return app.Use(async (context, next) =>
        {
            if (context.Request.Path.StartsWithSegments("/health"))
            {
                await next(context).ConfigureAwait(false);
                return;
            }
            if (!preparation.Ready)
            {
                await AnswerAsync(context).ConfigureAwait(false);
                return;
            }
            try
            {
                await next(context).ConfigureAwait(false);
            }
            catch (Exception ex) when (IsUnavailable(ex) && !context.Response.HasStarted)
            {
                Lost(log, context.Request.Path, ex);
                context.Response.Clear();
                await AnswerAsync(context).ConfigureAwait(false);
            }
        });
    }

    /// <summary>Whether the exception (or one inside it) says the database cannot be used now, rather than that a request was wrong.</summary>
    public static bool IsUnavailable(Exception? exception)
    {
        for (Exception? e = exception; e is not null; e = e.InnerException)
        {
            switch (e)
            {
                // Cannot open the file, an I/O error, the disk or quota full, the file read-only, locked too long.
                case SqliteException sqlite when sqlite.SqliteErrorCode is 14 or 10 or 13 or 8 or 5:
                    return true;
                // Connection exceptions (08), insufficient resources such as a full disk (53), the server shutting down or starting (57P).
                case PostgresException postgres:
                    return postgres.SqlState.StartsWith("08", StringComparison.Ordinal) || postgres.SqlState.StartsWith("53", StringComparison.Ordinal)
                        || postgres.SqlState.StartsWith("57P", StringComparison.Ordinal);
                // No answer from the server at all: refused, reset, timed out.
                case NpgsqlException:
                    return true;
            }
        }
        return false;
    }

    private static async Task AnswerAsync(HttpContext context)
    {
        context.Response.StatusCode = StatusCodes.Status503ServiceUnavailable;
        context.Response.Headers.RetryAfter = "10";
        context.Response.Headers.CacheControl = "no-store";
        if (Identity.IdentityRegistration.IsMachineReadable(context))
        {
            await Results.Problem(Message, statusCode: StatusCodes.Status503ServiceUnavailable, title: "The database is not available.").ExecuteAsync(context).ConfigureAwait(false);
            return;
        }
        context.Response.ContentType = "text/html; charset=utf-8";
        await context.Response.WriteAsync(
            "<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>CapReview is unavailable</title></head>" +
            "<body><main><h1>CapReview is unavailable</h1><p>" + Message + "</p></main></body></html>").ConfigureAwait(false);
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "The database could not be used for {Path}; answered 503.")]
    private static partial void Lost(ILogger logger, string path, Exception exception);
}
