namespace CapReview.Reviews.Records;

/// <summary>A cycle's packet job as the board and the API see it.</summary>
public sealed record PacketJobView(int CycleId, PacketJobStatus Status, int Attempts, string RequestedByName, DateTimeOffset RequestedAt,
    DateTimeOffset UpdatedAt, DateTimeOffset? CompletedAt, DateTimeOffset? NextAttemptAt, string? LastError, int PacketsStored)
{
    public static PacketJobView Of(PacketJob job)
    {
        ArgumentNullException.ThrowIfNull(job);
        return new(job.BudgetCycleId, job.Status, job.Attempts, job.RequestedByName, job.RequestedAt, job.UpdatedAt, job.CompletedAt,
            job.Status == PacketJobStatus.Queued ? job.NotBefore : null, job.LastError, job.PacketsStored);
    }
}
