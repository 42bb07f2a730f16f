using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace CapReview.Web.Operations;

/// <summary>Ready when the domain database answers and holds every migration this build knows; the reason otherwise.</summary>
public sealed class DatabaseHealthCheck(IDbContextFactory<CapReviewDbContext> contexts, DatabasePreparation? preparation = null) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        if (preparation is { Ready: false })
        {
            return HealthCheckResult.Unhealthy("The database has not been prepared yet: it could not be reached at start.");
        }
        try
        {
            await using CapReviewDbContext db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
            if (!await db.Database.CanConnectAsync(cancellationToken).ConfigureAwait(false))
            {
                return HealthCheckResult.Unhealthy("The database does not answer.");
            }
            var pending = (await db.Database.GetPendingMigrationsAsync(cancellationToken).ConfigureAwait(false)).ToList();
            return pending.Count == 0
                ? HealthCheckResult.Healthy("The database answers and is up to date.")
                : HealthCheckResult.Unhealthy($"The database lacks {pending.Count} migration(s); start the app once to apply them.");
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            // The reason goes to the log; the probe's answer names no server or credential.
            return HealthCheckResult.Unhealthy("The database cannot be reached.", ex);
        }
    }
}
