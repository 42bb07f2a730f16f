namespace CapReview.Reviews.Common;

/// <summary>
/// The system clock to the microsecond, the finest time PostgreSQL stores: a moment read back from either database
/// equals the one written, so the audit chain's hashes and exported documents come back unchanged.
/// </summary>
public sealed class StorageClock : TimeProvider
{
    public override DateTimeOffset GetUtcNow() => ToStored(System.GetUtcNow());

    /// <summary>A moment as the database keeps it: UTC, whole microseconds.</summary>
    public static DateTimeOffset ToStored(DateTimeOffset moment)
    {
        DateTimeOffset utc = moment.ToUniversalTime();
        return new DateTimeOffset(utc.Ticks - (utc.Ticks % 10), TimeSpan.Zero);
    }
}
