namespace CapReview.Packets.Tests;

/// <summary>The services' clock, moved on by the test: a retry's pause or a worker's lease, without waiting.</summary>
public sealed class SteppedClock(DateTimeOffset start) : TimeProvider
{
    private DateTimeOffset _now = start;

    public override DateTimeOffset GetUtcNow() => _now;

    public void Advance(TimeSpan by) => _now += by;
}
