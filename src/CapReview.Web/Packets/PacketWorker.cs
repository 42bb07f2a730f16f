using CapReview.Packets;
using CapReview.Reviews.Records;
using CapReview.Web.Operations;

namespace CapReview.Web.Packets;

/// <summary>
/// Makes the packets of decided cycles in the background: woken when a sign-off decides a cycle on this server, and
/// polling (Packets:WorkerPollSeconds, default 10) for jobs queued on another server or left by a restart. Nothing here
/// decides anything: the job is in the database and <see cref="PacketJobRunner"/> does the work.
/// </summary>
public sealed partial class PacketWorker(PacketJobRunner runner, PacketJobSignal signal, DatabasePreparation database, IConfiguration configuration,
    ILogger<PacketWorker> log) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var poll = TimeSpan.FromSeconds(Math.Clamp(configuration.GetValue("Packets:WorkerPollSeconds", 10), 1, 600));
        while (!stoppingToken.IsCancellationRequested)
        {
            if (database.Ready)
            {
                try
                {
                    await runner.RunDueAsync(stoppingToken).ConfigureAwait(false);
                }
                catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
                {
                    return;
                }
                catch (Exception ex)
                {
                    // The database went away between jobs: the job keeps its lease and is taken again later.
                    WorkerFailed(log, ex);
                }
            }
            try
            {
                await signal.WaitAsync(poll, stoppingToken).ConfigureAwait(false);
            }
            catch (OperationCanceledException)
            {
                return;
            }
        }
    }

    [LoggerMessage(Level = LogLevel.Error, Message = "The packet worker could not run its jobs; it tries again at its next poll.")]
    private static partial void WorkerFailed(ILogger logger, Exception exception);
}
