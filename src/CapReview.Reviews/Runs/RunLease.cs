namespace CapReview.Reviews.Runs;

/// <summary>A place taken in the <see cref="RunLimiter"/> for one run; disposing it gives the place back, once.</summary>
public sealed class RunLease : IDisposable
{
    private Action? _release;

    internal RunLease(Action release) => _release = release;

    public void Dispose() => Interlocked.Exchange(ref _release, null)?.Invoke();
}
