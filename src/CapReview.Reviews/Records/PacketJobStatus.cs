namespace CapReview.Reviews.Records;

/// <summary>Where the making of a decided cycle's packets stands.</summary>
public enum PacketJobStatus
{
    /// <summary>Waiting for the packet worker (at once, or after <see cref="PacketJob.NotBefore"/> when retrying).</summary>
    Queued,

    /// <summary>A worker holds it until its lease ends; a worker that died lets the lease run out and another takes it.</summary>
    Running,

    /// <summary>Every packet of the cycle is stored.</summary>
    Done,

    /// <summary>Every attempt failed; a board member or administrator asks for the missing packets again.</summary>
    Failed,
}
