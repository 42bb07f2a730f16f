namespace CapReview.Web.Tests.Security;

/// <summary>The server's clock, moved on by the test: the next 30-second code step, or hours of a session, without waiting.</summary>
public sealed class SteppedClock(DateTimeOffset start) : TimeProvider
{
    private DateTimeOffset _now = start;

    public override DateTimeOffset GetUtcNow() => _now;

    public void Advance(TimeSpan by) => _now += by;
}
