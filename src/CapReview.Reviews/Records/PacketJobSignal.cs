namespace CapReview.Reviews.Records;

/// <summary>
/// Wakes this server's packet worker as soon as a job is queued, instead of at its next poll. Only a hint: the job is in
/// the database, and a worker on another server (or after a restart) finds it by polling.
/// </summary>
public sealed class PacketJobSignal : IDisposable
{
    private readonly SemaphoreSlim _queued = new(0, 1);

    public void Notify()
    {
        try
        {
            _queued.Release();
        }
        catch (SemaphoreFullException)
        {
            // Already signalled: one wake-up serves every job queued before it.
        }
    }

    /// <summary>Waits for a signal or the poll interval, whichever comes first.</summary>
    public async Task WaitAsync(TimeSpan poll, CancellationToken cancellationToken) =>
        await _queued.WaitAsync(poll, cancellationToken).ConfigureAwait(false);

    public void Dispose() => _queued.Dispose();
}
