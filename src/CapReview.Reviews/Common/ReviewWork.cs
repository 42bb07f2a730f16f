using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Common;

/// <summary>
/// Runs one write operation: a fresh context, one transaction, one writer at a time (the audit chain needs its events
/// in order): in this process by a semaphore and, on PostgreSQL where several app servers share the database, across
/// them by a transaction-scoped advisory lock. Either everything the operation saved commits, or nothing does. A stale concurrency
/// token becomes a <see cref="ConcurrencyConflictException"/>.
/// </summary>
public sealed class ReviewWork(IDbContextFactory<CapReviewDbContext> contexts) : IDisposable
{
    private readonly SemaphoreSlim _writer = new(1, 1);

    /// <summary>The advisory lock key all CapReview writers take on PostgreSQL (an arbitrary constant of ours).</summary>
    private const string WriterLock = "20261202";

    public async Task<T> RunAsync<T>(Func<CapReviewDbContext, Task<T>> operation, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(operation);
        await _writer.WaitAsync(cancellationToken).ConfigureAwait(false);
        try
        {
            await using CapReviewDbContext db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
            await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken).ConfigureAwait(false);
            if (db.Database.IsNpgsql())
            {
                await db.Database.ExecuteSqlRawAsync("SELECT pg_advisory_xact_lock(" + WriterLock + ")", cancellationToken).ConfigureAwait(false);
            }
            T result = await operation(db).ConfigureAwait(false);
            await transaction.CommitAsync(cancellationToken).ConfigureAwait(false);
            return result;
        }
        catch (DbUpdateConcurrencyException)
        {
            throw new ConcurrencyConflictException("Someone else changed this since you opened it. Nothing was saved: reload to see their change, then make yours again.");
        }
        finally
        {
            _writer.Release();
        }
    }

    public void Dispose() => _writer.Dispose();

    /// <summary>A read: a fresh context, no tracking, no transaction.</summary>
    public async Task<T> ReadAsync<T>(Func<CapReviewDbContext, Task<T>> query, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(query);
        await using CapReviewDbContext db = await contexts.CreateDbContextAsync(cancellationToken).ConfigureAwait(false);
        db.ChangeTracker.QueryTrackingBehavior = QueryTrackingBehavior.NoTracking;
        return await query(db).ConfigureAwait(false);
    }
}
