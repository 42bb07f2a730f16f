using CapReview.Web.Hosting;

namespace CapReview.Web.Operations;

/// <summary>
/// Brings the database up to date before the app serves. When the database cannot be reached at start, the app starts
/// anyway: it answers every page and API call with a plain 503 (readiness fails too), logs why, and tries again every
/// few seconds (Storage:RetrySeconds) until the database answers; then it serves as usual.
/// </summary>
public sealed partial class DatabasePreparation(ILogger<DatabasePreparation> log)
{
    private volatile bool _ready;

    public bool Ready => _ready;

    /// <summary>One attempt now; on failure, further attempts in the background until one succeeds or the app stops.</summary>
    public async Task StartAsync(WebApplication app)
    {
        ArgumentNullException.ThrowIfNull(app);
        if (await TryAsync(app).ConfigureAwait(false))
        {
            return;
        }
        var every = TimeSpan.FromSeconds(Math.Max(1, app.Configuration.GetValue("Storage:RetrySeconds", 5)));
        CancellationToken stopping = app.Lifetime.ApplicationStopping;
        _ = Task.Run(async () =>
        {
            while (!stopping.IsCancellationRequested && !await TryAsync(app).ConfigureAwait(false))
            {
                await Task.Delay(every, stopping).ConfigureAwait(false);
            }
        }, stopping);
    }

    private async Task<bool> TryAsync(WebApplication app)
    {
        try
        {
            await app.InitializeDatabaseAsync().ConfigureAwait(false);
            await app.EnsureDemoAsync().ConfigureAwait(false);
            _ready = true;
            Prepared(log);
            return true;
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            Unavailable(log, ex.GetType().Name, ex.Message);
            return false;
        }
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "The database is up to date; serving.")]
    private static partial void Prepared(ILogger logger);

    [LoggerMessage(Level = LogLevel.Error, Message = "The database cannot be used ({Kind}: {Reason}); pages answer 503 until it can. Trying again shortly.")]
    private static partial void Unavailable(ILogger logger, string kind, string reason);
}
