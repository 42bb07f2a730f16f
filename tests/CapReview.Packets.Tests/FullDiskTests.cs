using CapReview.Reviews.Audit;
using CapReview.Reviews.Records;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using static CapReview.Packets.Tests.PacketDatabase;
using PigDocument = UglyToad.PdfPig.PdfDocument;

namespace CapReview.Packets.Tests;

/// <summary>
/// The disk fills up while a cycle's packets are written, at every point of the writing in turn: each attempt fails
/// cleanly, whatever was stored before it stays whole, no packet is stored in part, and once there is room again the
/// missing packets are made and served complete.
/// </summary>
public sealed class FullDiskTests(PacketDatabase db) : IClassFixture<PacketDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_full_disk_during_packet_writing_leaves_no_truncated_packet_and_the_retry_completes_the_set()
    {
        var (cycle, _) = await db.DecidedCycleAsync("Full disk 2027", (90_000, 16_000), (40_000, 9_000), (70_000, 8_000));
        var service = db.Get<PacketService>();
        var archive = db.Get<PacketArchive>();
        int failures = 0, failuresWithSomeStored = 0, stored = 0;

        // A little more room each time, until the whole set fits.
        for (int freePages = 0; freePages < 2_000; freePages += 6)
        {
            await using (var context = db.NewContext())
            {
                await context.Database.OpenConnectionAsync();
                db.Disk.Fill(context.Database.GetDbConnection(), freePages);
            }
            Exception? failure = null;
            try
            {
                await service.PublishCycleAsync(Board, cycle.Id, None);
            }
            catch (Exception ex) when (ex is DbUpdateException or SqliteException)
            {
                failure = ex;
            }
            finally
            {
                db.Disk.Free();
            }

            var packets = await archive.ListAsync(Finance, cycle.Id, None);
            Assert.True(packets.Count >= stored, "A stored packet went missing after a failed write.");
            stored = packets.Count;
            foreach (PacketSummary packet in packets)
            {
                AssertWhole(await archive.DownloadAsync(Finance, packet.Id, None));
            }
            if (failure is null)
            {
                break;
            }
            failures++;
            failuresWithSomeStored += stored > 0 ? 1 : 0;
            Assert.Equal(13, Innermost<SqliteException>(failure)!.SqliteErrorCode);
        }

        // The disk was full before the first packet and again between packets; the last attempt made the whole set.
        Assert.True(failures > failuresWithSomeStored && failuresWithSomeStored > 0, $"{failures} failures, {failuresWithSomeStored} after some packets were stored");
        Assert.Equal(4, stored);
        await using (var context = db.NewContext())
        {
            var ids = await context.ApprovalPackets.Where(p => p.BudgetCycleId == cycle.Id).Select(p => p.Id.ToString()).ToListAsync();
            var storedEvents = await context.AuditEvents.Where(e => e.Action == "packet.stored" && ids.Contains(e.EntityId)).Select(e => e.EntityId).ToListAsync();
            Assert.Equal(ids.Order(), storedEvents.Order());
            AuditVerification chain = await db.Get<AuditTrail>().VerifyAsync(context, [], None);
            Assert.True(chain.Intact, chain.Message);
            await AssertFileIntactAsync(context);
        }
    }

    /// <summary>
    /// A real full disk where the machine allows it (root may mount a tmpfs, as on CI): the database on a file system of
    /// 8 MiB filled to its last few kilobytes, so the operating system itself refuses the packets' pages (ENOSPC).
    /// Where mounting is not allowed the test says so and ends; the simulated one above covers every point of the write.
    /// </summary>
    [Fact]
    public async Task On_a_file_system_that_is_really_full_the_packets_are_refused_whole_and_made_once_there_is_room()
    {
        string mountPoint = Directory.CreateTempSubdirectory("capreview-fullfs-").FullName;
        if (!Run("mount", "-t", "tmpfs", "-o", "size=8m", "tmpfs", mountPoint))
        {
            Directory.Delete(mountPoint);
            Console.WriteLine("Mounting a tmpfs is not allowed here; the real full-disk test did not run.");
            return;
        }
        try
        {
            var small = new PacketDatabase { DatabaseFolder = mountPoint };
            await small.InitializeAsync();
            try
            {
                var (cycle, _) = await small.DecidedCycleAsync("Really full 2027", (90_000, 16_000), (40_000, 9_000));
                string filler = Path.Combine(mountPoint, "filler");
                await using (var fill = new FileStream(filler, FileMode.CreateNew))
                {
                    byte[] block = new byte[4096];
                    try
                    {
                        while (true)
                        {
                            fill.Write(block);
                            fill.Flush();
                        }
                    }
                    catch (IOException)
                    {
                        // The file system is full.
                    }
                }
                // Give back a few pages, less than one packet needs.
                using (var trim = new FileStream(filler, FileMode.Open))
                {
                    trim.SetLength(Math.Max(0, trim.Length - (16 * 1024)));
                }

                var refusal = await Assert.ThrowsAnyAsync<Exception>(() => small.Get<PacketService>().PublishCycleAsync(Board, cycle.Id, None));
                // SQLite reports a full disk as SQLITE_FULL, or as SQLITE_IOERR when the write of its journal is what fails.
                Assert.Contains(Innermost<SqliteException>(refusal)?.SqliteErrorCode ?? 0, new[] { 10, 13 });

                // Room again: SQLite rolls its journal back on the next open (it may not even read while the disk is full).
                File.Delete(filler);
                Assert.Empty(await small.Get<PacketArchive>().ListAsync(Finance, cycle.Id, None));
                var made = await small.Get<PacketService>().PublishCycleAsync(Board, cycle.Id, None);
                Assert.Equal(3, made.Count);
                foreach (PacketSummary packet in made)
                {
                    AssertWhole(await small.Get<PacketArchive>().DownloadAsync(Finance, packet.Id, None));
                }
                await using var context = small.NewContext();
                await AssertFileIntactAsync(context);
            }
            finally
            {
                await small.DisposeAsync();
            }
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            Run("umount", mountPoint);
            Directory.Delete(mountPoint, recursive: true);
        }
    }

    private static bool Run(string program, params string[] arguments)
    {
        try
        {
            var start = new System.Diagnostics.ProcessStartInfo(program) { RedirectStandardError = true, RedirectStandardOutput = true, UseShellExecute = false };
            foreach (string argument in arguments)
            {
                start.ArgumentList.Add(argument);
            }
            using var process = System.Diagnostics.Process.Start(start)!;
            process.WaitForExit();
            return process.ExitCode == 0;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            return false;
        }
    }

    /// <summary>SQLite's own check of the whole file: pages, indexes, free list.</summary>
    private static async Task AssertFileIntactAsync(CapReview.Reviews.Storage.CapReviewDbContext context)
    {
        await context.Database.OpenConnectionAsync();
        await using var check = context.Database.GetDbConnection().CreateCommand();
        check.CommandText = "PRAGMA integrity_check";
        Assert.Equal("ok", await check.ExecuteScalarAsync());
    }

    private static void AssertWhole(ApprovalPacket packet)
    {
        Assert.Equal(packet.FileSha256, PacketArchive.Sha256(packet.Content));
        Assert.Equal("%PDF-"u8.ToArray(), packet.Content[..5]);
        Assert.Contains("%%EOF", System.Text.Encoding.ASCII.GetString(packet.Content[^8..]), StringComparison.Ordinal);
        using PigDocument pdf = PigDocument.Open(packet.Content);
        Assert.True(pdf.NumberOfPages > 0);
    }

    private static T? Innermost<T>(Exception exception) where T : Exception
    {
        T? found = null;
        for (Exception? e = exception; e is not null; e = e.InnerException)
        {
            found = e as T ?? found;
        }
        return found;
    }
}
