using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Records;

/// <summary>
/// The durable queue of packet jobs: the sign-off that decides a cycle queues its job in the same transaction; a
/// person may ask again for missing packets; the packet worker claims due jobs one at a time and reports how they ended.
/// </summary>
public sealed class PacketJobs(ReviewWork work, AuditTrail audit, TimeProvider clock, PacketJobSignal signal)
{
    /// <summary>How long a worker holds a job before another may take it over.</summary>
    public static readonly TimeSpan Lease = TimeSpan.FromMinutes(5);

    /// <summary>Queues the cycle's job inside the caller's transaction (the sign-off that decides the cycle).</summary>
    internal static async Task QueueAsync(CapReviewDbContext db, int cycleId, Actor actor, DateTimeOffset now, CancellationToken cancellationToken)
    {
        PacketJob? job = await db.PacketJobs.SingleOrDefaultAsync(j => j.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
        if (job is null)
        {
            db.PacketJobs.Add(PacketJob.Request(cycleId, actor.UserId, actor.DisplayName, now));
        }
        else
        {
            job.RequestAgain(actor.UserId, actor.DisplayName, now);
        }
    }

    /// <summary>Wakes the worker after a transaction that queued a job has committed.</summary>
    public void Wake() => signal.Notify();

    /// <summary>
    /// Asks for the cycle's missing packets (after a failure, or to check): the board, finance and administrators, once
    /// the cycle is decided. A job already queued or running is left as it is.
    /// </summary>
    public async Task<PacketJobView> RequestAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        MayMakePackets(actor);
        PacketJobView view = await work.RunAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            if (cycle.Status is not (CycleStatus.Decided or CycleStatus.Closed))
            {
                throw new RuleViolationException($"Packets are made when {cycle.Name} is decided by its sign-offs.");
            }
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            var signOffs = await Decisions.DecisionService.ReadSignOffsAsync(db, cycleId, proposals, cancellationToken).ConfigureAwait(false);
            if (signOffs.Current.Count < cycle.RequiredSignOffs)
            {
                throw new RuleViolationException(CycleRecord.NotSignedHere(cycle.Name));
            }
            DateTimeOffset now = clock.GetUtcNow();
            PacketJob? job = await db.PacketJobs.SingleOrDefaultAsync(j => j.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
            bool queued;
            if (job is null)
            {
                job = PacketJob.Request(cycleId, actor.UserId, actor.DisplayName, now);
                db.PacketJobs.Add(job);
                queued = true;
            }
            else
            {
                queued = job.RequestAgain(actor.UserId, actor.DisplayName, now);
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            if (queued)
            {
                await audit.AppendAsync(db, actor, "packets.requested", "budget_cycle", cycleId.ToString(CultureInfo.InvariantCulture), null,
                    new { Status = job.Status.ToString() }, cancellationToken).ConfigureAwait(false);
            }
            return PacketJobView.Of(job);
        }, cancellationToken).ConfigureAwait(false);
        signal.Notify();
        return view;
    }

    /// <summary>The cycle's packet job, or null when none was ever queued (an undecided cycle, or one imported already decided).</summary>
    public Task<PacketJobView?> StatusAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        MayMakePackets(actor);
        return work.ReadAsync(async db =>
        {
            if (!await db.BudgetCycles.AnyAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false))
            {
                throw new NotFoundException("There is no such budget cycle.");
            }
            PacketJob? job = await db.PacketJobs.SingleOrDefaultAsync(j => j.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
            return job is null ? null : PacketJobView.Of(job);
        }, cancellationToken);
    }

    private static void MayMakePackets(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators make packets and follow their making.");
        }
    }

    /// <summary>Takes the oldest due job for this worker, or null when none is due.</summary>
    public Task<PacketJob?> ClaimAsync(CancellationToken cancellationToken) =>
        work.RunAsync(async db =>
        {
            DateTimeOffset now = clock.GetUtcNow();
            // Few rows ever wait here; the due test runs in memory so that it reads the same on SQLite and PostgreSQL.
            var waiting = await db.PacketJobs.Where(j => j.Status == PacketJobStatus.Queued || j.Status == PacketJobStatus.Running)
                .OrderBy(j => j.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            PacketJob? job = waiting.FirstOrDefault(j => j.IsDue(now));
            if (job is null)
            {
                return null;
            }
            job.Start(now, Lease);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            return job;
        }, cancellationToken);

    public Task CompleteAsync(int jobId, int packetsStored, CancellationToken cancellationToken) =>
        UpdateAsync(jobId, (job, now) => job.Complete(packetsStored, now), cancellationToken);

    public Task FailAsync(int jobId, string error, CancellationToken cancellationToken) =>
        UpdateAsync(jobId, (job, now) => job.Fail(error, now), cancellationToken);

    private Task<int> UpdateAsync(int jobId, Action<PacketJob, DateTimeOffset> change, CancellationToken cancellationToken) =>
        work.RunAsync(async db =>
        {
            PacketJob job = await db.PacketJobs.SingleAsync(j => j.Id == jobId, cancellationToken).ConfigureAwait(false);
            change(job, clock.GetUtcNow());
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            return job.Id;
        }, cancellationToken);
}
