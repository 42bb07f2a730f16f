using CapReview.Reviews.Audit;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Records;
using Microsoft.EntityFrameworkCore;
using static CapReview.Packets.Tests.PacketDatabase;

namespace CapReview.Packets.Tests;

/// <summary>
/// The making of a decided cycle's packets as a durable job: queued by the sign-off that decides the cycle, in the
/// same transaction, whichever face signed; run by the worker; retried after a pause when it fails; taken over when
/// its worker died; asked for again by a person once it has failed for good.
/// </summary>
public sealed class PacketJobTests : IAsyncLifetime
{
    private static readonly CancellationToken None = CancellationToken.None;
    private readonly SteppedClock _clock = new(new DateTimeOffset(2027, 4, 1, 9, 0, 0, TimeSpan.Zero));
    private readonly PacketDatabase _db;

    public PacketJobTests() => _db = new PacketDatabase { Clock = _clock };

    public Task InitializeAsync() => _db.InitializeAsync();

    public Task DisposeAsync() => _db.DisposeAsync();

    [Fact]
    public async Task The_sign_off_that_decides_a_cycle_queues_its_packets_and_the_runner_makes_them_once()
    {
        var (cycle, proposals) = await _db.DecidedCycleAsync("Queued 2027", (90_000, 16_000), (40_000, 9_000), (70_000, 8_000));

        PacketJobView? queued = await _db.Get<PacketJobs>().StatusAsync(Finance, cycle.Id, None);
        Assert.NotNull(queued);
        Assert.Equal(PacketJobStatus.Queued, queued.Status);
        Assert.Equal(0, queued.Attempts);
        // The second sign-off decided the cycle (DecidedCycleAsync signs as Tove, then Aino).
        Assert.Equal("Aino Board", queued.RequestedByName);
        Assert.Empty(await _db.Get<PacketArchive>().ListAsync(Finance, cycle.Id, None));

        Assert.Equal(1, await _db.Get<PacketJobRunner>().RunDueAsync(None));

        var packets = await _db.Get<PacketArchive>().ListAsync(Finance, cycle.Id, None);
        // Three decided proposals and the cycle.
        Assert.Equal(4, packets.Count);
        PacketJobView done = (await _db.Get<PacketJobs>().StatusAsync(Finance, cycle.Id, None))!;
        Assert.Equal(PacketJobStatus.Done, done.Status);
        Assert.Equal(1, done.Attempts);
        Assert.Equal(4, done.PacketsStored);
        Assert.Equal(_clock.GetUtcNow(), done.CompletedAt);
        Assert.Null(done.LastError);

        // Nothing is due any more; the packets are stored in the name of the member whose sign-off decided the cycle.
        Assert.Equal(0, await _db.Get<PacketJobRunner>().RunDueAsync(None));
        await using var context = _db.NewContext();
        var stored = await context.AuditEvents.Where(e => e.Action == "packet.stored").Select(e => e.UserId).ToListAsync();
        Assert.Equal(["board-2", "board-2", "board-2", "board-2"], stored);
        Assert.True((await _db.Get<AuditTrail>().VerifyAsync(context, [], None)).Intact);
        Assert.Equal(3, proposals.Count);
    }

    [Fact]
    public async Task An_undecided_cycle_has_no_job_and_a_first_sign_off_queues_none()
    {
        var (cycle, proposals) = await _db.DecidedCycleAsync("Decided 2027", (50_000, 9_000));
        var marr = (await _db.Get<Reviews.Cycles.CycleService>().GetAsync(cycle.Id, None)).Marr;
        var open = await _db.Get<Reviews.Cycles.CycleService>().CreateAsync(Admin,
            new Reviews.Cycles.NewBudgetCycle("Undecided 2027", 100_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), None);
        Assert.Null(await _db.Get<PacketJobs>().StatusAsync(Finance, open.Id, None));
        var refusal = await Assert.ThrowsAsync<Reviews.Common.RuleViolationException>(() => _db.Get<PacketJobs>().RequestAsync(Board, open.Id, None));
        Assert.Equal("Packets are made when Undecided 2027 is decided by its sign-offs.", refusal.Message);
        await Assert.ThrowsAsync<Reviews.Common.AccessDeniedException>(() => _db.Get<PacketJobs>().RequestAsync(Lead, cycle.Id, None));
        Assert.Single(proposals);
    }

    [Fact]
    public async Task A_failed_attempt_is_retried_after_a_growing_pause_and_the_fifth_failure_waits_for_a_person()
    {
        var (cycle, _) = await _db.DecidedCycleAsync("Retried 2027", (90_000, 16_000), (40_000, 9_000));
        var runner = _db.Get<PacketJobRunner>();
        var jobs = _db.Get<PacketJobs>();

        // Our own back-off rule (common practice, no source): 15 s, then four times as long after each failure.
        TimeSpan[] pauses = [TimeSpan.FromSeconds(15), TimeSpan.FromMinutes(1), TimeSpan.FromMinutes(4), TimeSpan.FromMinutes(16)];
        for (int attempt = 1; attempt <= PacketJob.MaxAttempts; attempt++)
        {
            FillDisk();
            try
            {
                Assert.Equal(1, await runner.RunDueAsync(None));
            }
            finally
            {
                _db.Disk.Free();
            }
            PacketJobView job = (await jobs.StatusAsync(Finance, cycle.Id, None))!;
            Assert.Equal(attempt, job.Attempts);
            Assert.Contains("database or disk is full", job.LastError, StringComparison.Ordinal);
            if (attempt < PacketJob.MaxAttempts)
            {
                Assert.Equal(PacketJobStatus.Queued, job.Status);
                Assert.Equal(_clock.GetUtcNow() + pauses[attempt - 1], job.NextAttemptAt);
                // Not due a moment before its pause ends.
                _clock.Advance(pauses[attempt - 1] - TimeSpan.FromSeconds(1));
                Assert.Equal(0, await runner.RunDueAsync(None));
                _clock.Advance(TimeSpan.FromSeconds(1));
            }
            else
            {
                Assert.Equal(PacketJobStatus.Failed, job.Status);
                Assert.Null(job.NextAttemptAt);
            }
        }
        _clock.Advance(TimeSpan.FromDays(1));
        Assert.Equal(0, await runner.RunDueAsync(None));

        // A board member asks again once the disk has room: the set is completed.
        PacketJobView asked = await jobs.RequestAsync(Board, cycle.Id, None);
        Assert.Equal(PacketJobStatus.Queued, asked.Status);
        Assert.Equal("Tove Board", asked.RequestedByName);
        Assert.Equal(1, await runner.RunDueAsync(None));
        Assert.Equal(PacketJobStatus.Done, (await jobs.StatusAsync(Finance, cycle.Id, None))!.Status);
        Assert.Equal(3, (await _db.Get<PacketArchive>().ListAsync(Finance, cycle.Id, None)).Count);
    }

    [Fact]
    public async Task A_job_whose_worker_died_is_taken_over_when_its_lease_runs_out()
    {
        var (cycle, _) = await _db.DecidedCycleAsync("Taken over 2027", (60_000, 11_000));
        var jobs = _db.Get<PacketJobs>();

        // A worker claims the job and dies before it ends.
        PacketJob? claimed = await jobs.ClaimAsync(None);
        Assert.NotNull(claimed);
        Assert.Null(await jobs.ClaimAsync(None));
        Assert.Equal(PacketJobStatus.Running, (await jobs.StatusAsync(Finance, cycle.Id, None))!.Status);

        _clock.Advance(PacketJobs.Lease - TimeSpan.FromSeconds(1));
        Assert.Equal(0, await _db.Get<PacketJobRunner>().RunDueAsync(None));
        _clock.Advance(TimeSpan.FromSeconds(1));
        Assert.Equal(1, await _db.Get<PacketJobRunner>().RunDueAsync(None));

        PacketJobView done = (await jobs.StatusAsync(Finance, cycle.Id, None))!;
        Assert.Equal(PacketJobStatus.Done, done.Status);
        Assert.Equal(2, done.Attempts);
        Assert.Equal(2, (await _db.Get<PacketArchive>().ListAsync(Finance, cycle.Id, None)).Count);
    }

    [Fact]
    public async Task Asking_again_while_a_job_is_queued_leaves_it_as_it_is()
    {
        var (cycle, _) = await _db.DecidedCycleAsync("Asked twice 2027", (60_000, 11_000));
        PacketJobView again = await _db.Get<PacketJobs>().RequestAsync(Finance, cycle.Id, None);
        Assert.Equal(PacketJobStatus.Queued, again.Status);
        Assert.Equal("Aino Board", again.RequestedByName);
        await using var context = _db.NewContext();
        Assert.Equal(1, await context.PacketJobs.CountAsync(j => j.BudgetCycleId == cycle.Id));
        Assert.False(await context.AuditEvents.AnyAsync(e => e.Action == "packets.requested"));
    }

    /// <summary>Room for the job's own row, none for a packet.</summary>
    private void FillDisk()
    {
        using var context = _db.NewContext();
        context.Database.OpenConnection();
        _db.Disk.Fill(context.Database.GetDbConnection(), 2);
    }
}
