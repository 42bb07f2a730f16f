using System.Globalization;
using System.Security.Cryptography;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Records;

/// <summary>
/// Stores each packet once, with its hash, and hands it out unchanged: to finance, the board and administrators, and
/// to the lead whose proposal it records. Every download is an audit event in the same transaction.
/// </summary>
public sealed class PacketArchive(ReviewWork work, AuditTrail audit)
{
    /// <summary>Where the audit chain stands, for the packet about to be signed to state.</summary>
    public Task<AuditHead> AuditHeadAsync(CancellationToken cancellationToken) =>
        work.ReadAsync(db => AuditTrail.HeadAsync(db, cancellationToken), cancellationToken);

    /// <summary>Stores the packet unless one of its kind already exists for the cycle and proposal; returns the stored one.</summary>
    public Task<PacketSummary> StoreOnceAsync(Actor actor, ApprovalPacket packet, CancellationToken cancellationToken)
    {
        // The packet took its hash from its own bytes when it was made (ApprovalPacket.Made).
        ArgumentNullException.ThrowIfNull(packet);
        return work.RunAsync(async db =>
        {
            ApprovalPacket? existing = await Find(db, packet.Kind, packet.BudgetCycleId, packet.ProposalId).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
            if (existing is not null)
            {
                return Summary(existing);
            }
            db.ApprovalPackets.Add(packet);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "packet.stored", "approval_packet", packet.Id.ToString(CultureInfo.InvariantCulture), null,
                new { packet.Kind, packet.BudgetCycleId, packet.ProposalId, packet.VersionNumber, packet.FileSha256, packet.DevelopmentCertificate }, cancellationToken).ConfigureAwait(false);
            return Summary(packet);
        }, cancellationToken);
    }

    public Task<bool> ExistsAsync(PacketKind kind, int cycleId, int? proposalId, CancellationToken cancellationToken) =>
        work.ReadAsync(db => Find(db, kind, cycleId, proposalId).AnyAsync(cancellationToken), cancellationToken);

    /// <summary>The packets of a cycle the actor may download, without their bytes.</summary>
    public Task<IReadOnlyList<PacketSummary>> ListAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync<IReadOnlyList<PacketSummary>>(async db =>
        {
            var rows = await db.ApprovalPackets.Where(p => p.BudgetCycleId == cycleId)
                .Select(p => new PacketSummary(p.Id, p.Kind, p.BudgetCycleId, p.ProposalId, p.VersionNumber, p.FileName, p.FileSha256, p.Content.Length, p.CreatedAt, p.DevelopmentCertificate))
                .ToListAsync(cancellationToken).ConfigureAwait(false);
            var own = await OwnProposalsAsync(db, actor, cancellationToken).ConfigureAwait(false);
            return [.. rows.Where(p => MaySee(actor, p.ProposalId, own)).OrderBy(p => p.Kind).ThenBy(p => p.ProposalId)];
        }, cancellationToken);
    }

    /// <summary>The packet of a proposal, if one was made and the actor may see it.</summary>
    public Task<PacketSummary?> ForProposalAsync(Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync(async db =>
        {
            var own = await OwnProposalsAsync(db, actor, cancellationToken).ConfigureAwait(false);
            if (!MaySee(actor, proposalId, own))
            {
                return null;
            }
            return await db.ApprovalPackets.Where(p => p.Kind == PacketKind.Proposal && p.ProposalId == proposalId)
                .Select(p => new PacketSummary(p.Id, p.Kind, p.BudgetCycleId, p.ProposalId, p.VersionNumber, p.FileName, p.FileSha256, p.Content.Length, p.CreatedAt, p.DevelopmentCertificate))
                .FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    /// <summary>The packet's bytes for a download, checked against the stored hash; the download is audited.</summary>
    public Task<ApprovalPacket> DownloadAsync(Actor actor, int packetId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.RunAsync(async db =>
        {
            ApprovalPacket? packet = await db.ApprovalPackets.AsNoTracking().SingleOrDefaultAsync(p => p.Id == packetId, cancellationToken).ConfigureAwait(false);
            var own = await OwnProposalsAsync(db, actor, cancellationToken).ConfigureAwait(false);
            if (packet is null || !MaySee(actor, packet.ProposalId, own))
            {
                // A packet the actor may not see is reported exactly like a missing one.
                throw new NotFoundException("There is no such packet.");
            }
            if (Sha256(packet.Content) != packet.FileSha256)
            {
                throw new RuleViolationException("The stored packet no longer matches the hash recorded when it was made; it is not served. Tell an administrator.");
            }
            await audit.AppendAsync(db, actor, "packet.downloaded", "approval_packet", packet.Id.ToString(CultureInfo.InvariantCulture), null,
                new { packet.Kind, packet.BudgetCycleId, packet.ProposalId, packet.FileSha256 }, cancellationToken).ConfigureAwait(false);
            return packet;
        }, cancellationToken);
    }

    public static string Sha256(byte[] content) => Convert.ToHexStringLower(SHA256.HashData(content));

    private static bool MaySee(Actor actor, int? proposalId, HashSet<int> own) =>
        actor.Has(Role.Finance) || actor.Has(Role.Reviewer) || actor.Has(Role.Administrator)
        || (actor.Has(Role.ProjectLead) && proposalId is int id && own.Contains(id));

    private static async Task<HashSet<int>> OwnProposalsAsync(CapReviewDbContext db, Actor actor, CancellationToken cancellationToken) =>
        [.. await db.Proposals.Where(p => p.OwnerId == actor.UserId).Select(p => p.Id).ToListAsync(cancellationToken).ConfigureAwait(false)];

    private static IQueryable<ApprovalPacket> Find(CapReviewDbContext db, PacketKind kind, int cycleId, int? proposalId) =>
        db.ApprovalPackets.Where(p => p.Kind == kind && p.BudgetCycleId == cycleId && p.ProposalId == proposalId);

    private static PacketSummary Summary(ApprovalPacket p) =>
        new(p.Id, p.Kind, p.BudgetCycleId, p.ProposalId, p.VersionNumber, p.FileName, p.FileSha256, p.Content.Length, p.CreatedAt, p.DevelopmentCertificate);
}
