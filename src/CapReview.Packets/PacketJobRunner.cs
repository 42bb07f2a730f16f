using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Records;

namespace CapReview.Packets;

/// <summary>
/// Runs the due packet jobs one after another: each makes whatever packets its cycle still lacks, in the name of the
/// member who asked, and is marked done, or failed with the reason and retried after a pause. The web host's worker
/// calls it when woken and at every poll; tests call it directly.
/// </summary>
public sealed class PacketJobRunner(PacketJobs queue, PacketService packets)
{
    /// <summary>Runs every job that is due now; returns how many were run.</summary>
    public async Task<int> RunDueAsync(CancellationToken cancellationToken)
    {
        int run = 0;
        while (await queue.ClaimAsync(cancellationToken).ConfigureAwait(false) is { } job)
        {
            run++;
            // The member who asked is a board member, finance or an administrator (checked when the job was queued).
            var requester = Actor.Of(job.RequestedBy, job.RequestedByName, Role.Reviewer);
            try
            {
                var stored = await packets.PublishCycleAsync(requester, job.BudgetCycleId, cancellationToken).ConfigureAwait(false);
                await queue.CompleteAsync(job.Id, stored.Count, cancellationToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
            {
                // The host is stopping: the lease runs out and the next worker takes the job again.
                throw;
            }
            catch (Exception ex)
            {
                await queue.FailAsync(job.Id, Describe(ex), CancellationToken.None).ConfigureAwait(false);
            }
        }
        return run;
    }

    /// <summary>The failure in words for the board; the domain's own refusals are already such words.</summary>
    private static string Describe(Exception ex) => ex is ReviewException
        ? ex.Message
        : $"The packets could not be made ({ex.GetBaseException().Message}).";
}
