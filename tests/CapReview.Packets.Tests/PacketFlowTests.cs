using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using Microsoft.EntityFrameworkCore;
using UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor;
using static CapReview.Packets.Tests.PacketDatabase;
using PigDocument = UglyToad.PdfPig.PdfDocument;

namespace CapReview.Packets.Tests;

public sealed class PacketFlowTests(PacketDatabase db) : IClassFixture<PacketDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_decided_cycle_gets_one_signed_packet_per_decided_proposal_and_one_for_the_cycle_made_once()
    {
        var (cycle, proposals) = await db.DecidedCycleAsync("Packets 2027", (120_000, 24_000), (80_000, 15_000), (60_000, 7_000));
        var made = await db.Get<PacketService>().PublishCycleAsync(Board, cycle.Id, None);
        Assert.Equal(4, made.Count);
        Assert.Single(made, p => p.Kind == PacketKind.Cycle);
        var again = await db.Get<PacketService>().PublishCycleAsync(Finance, cycle.Id, None);
        Assert.Equal(made.Select(p => (p.Id, p.FileSha256)), again.Select(p => (p.Id, p.FileSha256)));

        var archive = db.Get<PacketArchive>();
        var first = await archive.ForProposalAsync(Lead, proposals[0].Id, None);
        var stored = await archive.DownloadAsync(Lead, first!.Id, None);
        Assert.Equal(PacketArchive.Sha256(stored.Content), stored.FileSha256);
        Assert.Equal(proposals[0].Latest.AssumptionsHash, stored.AssumptionsHash);
        using (PigDocument pdf = PigDocument.Open(stored.Content))
        {
            string text = string.Join("\n", pdf.GetPages().Select(p => ContentOrderTextExtractor.GetText(p)));
            Assert.Contains("Install in August", text);
            Assert.Contains("Tove Board", text);
            Assert.Contains("Aino Board", text);
            Assert.Contains(proposals[0].Latest.AssumptionsHash, text.Replace("\n", "", StringComparison.Ordinal));
            // The audit chain's head at signing, as the stored row records it: an anchor outside the database's reach.
            await using var rows = db.NewContext();
            var row = await rows.ApprovalPackets.SingleAsync(p => p.Id == first.Id);
            static string Packed(string s) => string.Concat(s.Where(c => !char.IsWhiteSpace(c)));
            Assert.Contains(Packed($"{row.AuditEventCount} events at signing, last hash {row.AuditHeadHash}"), Packed(text), StringComparison.Ordinal);
            var chain = await db.Get<CapReview.Reviews.Audit.AuditQueries>().VerifyAsync(Admin, None);
            Assert.True(chain.Intact, chain.Message);
            Assert.Equal(4, chain.AnchorsChecked);
        }
        Assert.Contains("Signature is Valid.", Pdfsig(stored.Content));

        var cyclePacket = made.Single(p => p.Kind == PacketKind.Cycle);
        byte[] cycleBytes = (await archive.DownloadAsync(Finance, cyclePacket.Id, None)).Content;
        if (Environment.GetEnvironmentVariable("CAPREVIEW_PACKETS") is { Length: > 0 } folder)
        {
            Directory.CreateDirectory(folder);
            File.WriteAllBytes(Path.Combine(folder, "stored-cycle.pdf"), cycleBytes);
        }
        using (PigDocument pdf = PigDocument.Open(cycleBytes))
        {
            Assert.True(pdf.TryGetBookmarks(out var bookmarks));
            Assert.Equal(["Cycle summary", .. proposals.Select(p => $"{p.Reference} {p.Title}")], bookmarks.Roots.Select(b => b.Title));
            string summary = string.Join("\n", pdf.GetPages().Take(2).Select(p => ContentOrderTextExtractor.GetText(p)));
            Assert.Contains("Rejected", summary);
            // The basis the selection compared unequal lives on, in the words of the portfolio page.
            static string Packed(string s) => string.Concat(s.Where(c => !char.IsWhiteSpace(c)));
            Assert.Contains(Packed("Basis of the selection"), Packed(summary), StringComparison.Ordinal);
            Assert.Contains(Packed("present worth of each proposal renewed like for like: the alternatives of a group over the least common multiple"), Packed(summary), StringComparison.Ordinal);
        }

        await using var context = db.NewContext();
        var downloads = await context.AuditEvents.Where(e => e.Action == "packet.downloaded").Select(e => e.UserId).ToListAsync();
        Assert.Equal([Lead.UserId, Finance.UserId], downloads);
    }

    [Fact]
    public async Task Leads_see_only_their_own_packets_and_an_altered_stored_packet_is_not_served()
    {
        var (cycle, proposals) = await db.DecidedCycleAsync("Access 2027", (50_000, 9_000));
        var made = await db.Get<PacketService>().PublishCycleAsync(Board, cycle.Id, None);
        var archive = db.Get<PacketArchive>();
        Assert.Single(await archive.ListAsync(Lead, cycle.Id, None));
        Assert.Empty(await archive.ListAsync(OtherLead, cycle.Id, None));
        Assert.Null(await archive.ForProposalAsync(OtherLead, proposals[0].Id, None));
        int proposalPacket = made.Single(p => p.Kind == PacketKind.Proposal).Id;
        int cyclePacket = made.Single(p => p.Kind == PacketKind.Cycle).Id;
        await Assert.ThrowsAsync<NotFoundException>(() => archive.DownloadAsync(OtherLead, proposalPacket, None));
        await Assert.ThrowsAsync<NotFoundException>(() => archive.DownloadAsync(Lead, cyclePacket, None));
        await Assert.ThrowsAsync<AccessDeniedException>(() => db.Get<PacketService>().PublishCycleAsync(Lead, cycle.Id, None));

        await using (var context = db.NewContext())
        {
            // The database itself refuses to swap a stored file.
            var refused = await Assert.ThrowsAnyAsync<Microsoft.Data.Sqlite.SqliteException>(() =>
                context.Database.ExecuteSqlRawAsync("UPDATE approval_packet SET Content = X'255044462D' WHERE Id = {0}", proposalPacket));
            Assert.Contains("approval_packet rows are written once: update refused", refused.Message);
            // Someone who owns the database file drops the guard and swaps the stored file.
            await context.Database.ExecuteSqlRawAsync("DROP TRIGGER approval_packet_written_once_update");
            await context.Database.ExecuteSqlRawAsync("UPDATE approval_packet SET Content = X'255044462D' WHERE Id = {0}", proposalPacket);
            var packet = await context.ApprovalPackets.SingleAsync(p => p.Id == proposalPacket);
            context.Entry(packet).Property(p => p.FileName).CurrentValue = "changed.pdf";
            Assert.Throws<RuleViolationException>(() => context.SaveChanges());
        }
        await Assert.ThrowsAsync<RuleViolationException>(() => archive.DownloadAsync(Finance, proposalPacket, None));
    }

    [Fact]
    public async Task Packets_wait_for_the_cycle_to_be_decided()
    {
        var marr = await db.Get<Reviews.Marr.MarrPolicyService>().AddVersionAsync(Admin,
            new Reviews.Marr.NewMarrPolicy(0.08, Engine.Rates.RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Open"), None);
        var open = await db.Get<Reviews.Cycles.CycleService>().CreateAsync(Admin,
            new Reviews.Cycles.NewBudgetCycle("Still open 2027", 1_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 2, 1)), None);
        var refusal = await Assert.ThrowsAsync<RuleViolationException>(() => db.Get<PacketService>().PublishCycleAsync(Board, open.Id, None));
        Assert.Contains("decided", refusal.Message);
    }

    private static string Pdfsig(byte[] pdf)
    {
        string path = Path.Combine(Directory.CreateTempSubdirectory("capreview-pdfsig-").FullName, "packet.pdf");
        File.WriteAllBytes(path, pdf);
        return ProposalPacketTests.Pdfsig(path);
    }
}
