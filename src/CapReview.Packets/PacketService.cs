using System.Globalization;
using CapReview.Packets.Content;
using CapReview.Packets.Signing;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Organisation;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Interchange;
using CapReview.Reviews.Records;

namespace CapReview.Packets;

/// <summary>
/// Makes a decided cycle's packets: one per decided proposal and one for the cycle, each signed and stored once. Run
/// when the last sign-off decides the cycle; running it again makes only what is missing.
/// </summary>
public sealed class PacketService(DecisionRecords records, PortfolioService portfolio, PacketArchive archive, OrganisationQueries organisation,
    PacketCertificateSource certificates, TimeProvider clock, PacketOptions options)
{
    public async Task<IReadOnlyList<PacketSummary>> PublishCycleAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators make packets.");
        }
        CycleRecord record = await records.ForCycleAsync(cycleId, cancellationToken).ConfigureAwait(false);
        if (record.Cycle.Status is not (CycleStatus.Decided or CycleStatus.Closed))
        {
            throw new RuleViolationException($"Packets are made when {record.Cycle.Name} is decided by its sign-offs.");
        }
        if (!record.SignedHere)
        {
            throw new RuleViolationException(CycleRecord.NotSignedHere(record.Cycle.Name));
        }
        OrganisationProfile profile = await organisation.GetAsync(cancellationToken).ConfigureAwait(false)
            ?? throw new InvalidOperationException("The organisation profile is missing.");
        var who = new PacketOrganisation(profile.Name, profile.CurrencyCode, CultureInfo.GetCultureInfo(profile.CultureName));
        PacketCertificate certificate = certificates.Get(profile.Name);
        DateTimeOffset now = clock.GetUtcNow();
        AuditHead head = await archive.AuditHeadAsync(cancellationToken).ConfigureAwait(false);

        // The domain computes every figure once; each packet lays out the ones it needs.
        var figures = record.Decided.ToDictionary(d => d.Proposal.Id, d => VersionFigures.Of(d.Proposal, d.Proposal.Version(d.Decision.VersionNumber), record.Marr,
            record.Cycle.StudyPeriodYears, simulate: true, cancellationToken));
        // A decision copied from another installation's document is no act of this board: no packet is signed for it.
        foreach (var (proposal, decision) in record.Decided.Where(d => !CycleImporter.IsImported(d.Decision.DecidedBy)))
        {
            if (await archive.ExistsAsync(PacketKind.Proposal, cycleId, proposal.Id, cancellationToken).ConfigureAwait(false))
            {
                continue;
            }
            if (!proposal.Version(decision.VersionNumber).Intact)
            {
                throw new RuleViolationException($"The stored assumptions of {proposal.Reference} version {decision.VersionNumber} no longer match the SHA-256 the board decided on: they were changed outside the app, and no packet is signed for them.");
            }
            var data = new ProposalPacketData(who, record.Cycle, record.Marr, proposal, decision, figures[proposal.Id], record.SignOffs, now, certificate.Notice, options.Paper, head);
            byte[] bytes = PacketRenderer.Proposal(data, certificate);
            await archive.StoreOnceAsync(actor, Packet(PacketKind.Proposal, record, proposal.Id, decision.VersionNumber, decision.AssumptionsHash,
                $"{proposal.Reference}-approval-packet.pdf", bytes, certificate, now, head), cancellationToken).ConfigureAwait(false);
        }
        if (!await archive.ExistsAsync(PacketKind.Cycle, cycleId, null, cancellationToken).ConfigureAwait(false))
        {
            PortfolioResult? selection = record.Decided.Count == 0 ? null
                : await portfolio.SelectForRecordAsync(actor, cycleId, new PortfolioQuery(), cancellationToken).ConfigureAwait(false);
            var data = new CyclePacketData(who, record.Cycle, record.Marr, record.SignOffs, record.Decided, figures, selection, now, certificate.Notice, options.Paper, record.Import, head);
            byte[] bytes = PacketRenderer.Cycle(data, certificate);
            string name = string.Concat(record.Cycle.Name.Select(c => char.IsLetterOrDigit(c) ? char.ToLowerInvariant(c) : '-')) + "-cycle-packet.pdf";
            await archive.StoreOnceAsync(actor, Packet(PacketKind.Cycle, record, null, null, null, name, bytes, certificate, now, head), cancellationToken).ConfigureAwait(false);
        }
        return await archive.ListAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
    }

    private static ApprovalPacket Packet(PacketKind kind, CycleRecord record, int? proposalId, int? version, string? hash, string fileName, byte[] bytes,
        PacketCertificate certificate, DateTimeOffset now, AuditHead head) =>
        ApprovalPacket.Made(new PacketRecord(kind, record.Cycle.Id, proposalId, version, hash, record.Marr.Id), fileName, bytes, now,
            new SigningCertificate(certificate.Certificate.Subject, certificate.Certificate.Thumbprint, certificate.Development), head);
}
