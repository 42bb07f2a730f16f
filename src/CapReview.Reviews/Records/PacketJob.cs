namespace CapReview.Reviews.Records;

/// <summary>
/// The durable request to make a decided cycle's packets: written in the same transaction as the sign-off that decides
/// the cycle, so a restart between the two cannot lose it, and picked up by the packet worker. One row per cycle; a
/// request for the missing packets queues the same row again. Making packets is idempotent, so running a job twice
/// (a lease that ran out while its worker was still busy) stores nothing twice.
/// </summary>
public sealed class PacketJob
{
    /// <summary>Attempts before the job is left failed for a person to retry.</summary>
    public const int MaxAttempts = 5;

    private PacketJob()
    {
    }

    public int Id { get; private set; }

    public int BudgetCycleId { get; private set; }

    /// <summary>Who asked (the member whose sign-off decided the cycle, or who asked again): the packets are stored in their name.</summary>
    public string RequestedBy { get; private set; } = "";

    public string RequestedByName { get; private set; } = "";

    public PacketJobStatus Status { get; private set; }

    public int Attempts { get; private set; }

    /// <summary>Not to be started before this moment (the back-off after a failure).</summary>
    public DateTimeOffset NotBefore { get; private set; }

    /// <summary>While running: the moment the worker's hold ends.</summary>
    public DateTimeOffset? LeaseUntil { get; private set; }

    public DateTimeOffset RequestedAt { get; private set; }

    public DateTimeOffset UpdatedAt { get; private set; }

    public DateTimeOffset? CompletedAt { get; private set; }

    /// <summary>What went wrong in the last failed attempt, in words for the board.</summary>
    public string? LastError { get; private set; }

    /// <summary>Packets stored for the cycle when the job completed.</summary>
    public int PacketsStored { get; private set; }

    public static PacketJob Request(int cycleId, string userId, string userName, DateTimeOffset now) => new()
    {
        BudgetCycleId = cycleId,
        RequestedBy = userId,
        RequestedByName = userName,
        Status = PacketJobStatus.Queued,
        NotBefore = now,
        RequestedAt = now,
        UpdatedAt = now,
    };

    /// <summary>Asks again for the missing packets: a finished or failed job is queued afresh; a queued or running one is left alone.</summary>
    public bool RequestAgain(string userId, string userName, DateTimeOffset now)
    {
        if (Status is PacketJobStatus.Queued or PacketJobStatus.Running)
        {
            return false;
        }
        RequestedBy = userId;
        RequestedByName = userName;
        Status = PacketJobStatus.Queued;
        Attempts = 0;
        NotBefore = now;
        RequestedAt = now;
        UpdatedAt = now;
        CompletedAt = null;
        LastError = null;
        return true;
    }

    /// <summary>Whether a worker may take the job now: queued and due, or running under a lease that ran out.</summary>
    public bool IsDue(DateTimeOffset now) =>
        (Status == PacketJobStatus.Queued && NotBefore <= now) || (Status == PacketJobStatus.Running && LeaseUntil <= now);

    public void Start(DateTimeOffset now, TimeSpan lease)
    {
        if (!IsDue(now))
        {
            throw new InvalidOperationException("The packet job is not due.");
        }
        Status = PacketJobStatus.Running;
        Attempts++;
        LeaseUntil = now + lease;
        UpdatedAt = now;
    }

    public void Complete(int packetsStored, DateTimeOffset now)
    {
        Status = PacketJobStatus.Done;
        PacketsStored = packetsStored;
        LeaseUntil = null;
        LastError = null;
        CompletedAt = now;
        UpdatedAt = now;
    }

    /// <summary>Records a failed attempt: queued again after a growing pause, or failed for good after <see cref="MaxAttempts"/>.</summary>
    public void Fail(string error, DateTimeOffset now)
    {
        LastError = error.Length > 500 ? error[..500] : error;
        LeaseUntil = null;
        UpdatedAt = now;
        if (Attempts >= MaxAttempts)
        {
            Status = PacketJobStatus.Failed;
            return;
        }
        Status = PacketJobStatus.Queued;
        NotBefore = now + RetryPause(Attempts);
    }

    /// <summary>15 s, 1 min, 4 min, 16 min: long enough for a full disk or a lost database to be put right.</summary>
    public static TimeSpan RetryPause(int attemptsMade) => TimeSpan.FromSeconds(15 * Math.Pow(4, Math.Max(0, attemptsMade - 1)));
}
