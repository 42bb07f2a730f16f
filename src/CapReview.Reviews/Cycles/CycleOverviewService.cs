using CapReview.Reviews.Access;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;

namespace CapReview.Reviews.Cycles;

/// <summary>
/// A cycle for its review: every proposal's measures at the cycle's MARR for its risk class (on its latest submitted
/// version), what the actor may decide, the sign-offs, the packets and the job that makes them. Access is that of the services it reads.
/// </summary>
public sealed class CycleOverviewService(CycleService cycles, ProposalService proposals, DecisionService decisions, PacketArchive archive, PacketJobs jobs, DecisionRecords records)
{
    public async Task<CycleOverview> GetAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        var (cycle, marr) = await cycles.GetAsync(cycleId, cancellationToken).ConfigureAwait(false);
        var listed = await proposals.ListInCycleAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        var rows = listed.Select(p =>
        {
            VersionView shown = p.Versions.Where(v => v.IsFrozen).OrderBy(v => v.Number).LastOrDefault() ?? p.Latest;
            int submitted = p.Versions.Where(v => v.IsFrozen).Select(v => v.Number).DefaultIfEmpty(0).Max();
            // An approval or rejection can still be changed until the cycle is signed off.
            bool decidable = actor.Has(Role.Reviewer) && cycle.Status is CycleStatus.Open or CycleStatus.InReview
                && p.Status is ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.Approved or ProposalStatus.Rejected;
            return new CycleProposalRow(p, submitted, marr.RateFor(p.RiskClass), VersionComparison.Evaluate(shown.Assumptions, marr, p.RiskClass), decidable);
        }).ToList();
        var signOffs = await decisions.SignOffsAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        IReadOnlyList<PacketSummary> packets = [];
        bool packetsMissing = false;
        PacketJobView? packetJob = null;
        int packetsExpected = 0;
        bool signedHere = signOffs.Current.Count >= cycle.RequiredSignOffs;
        if (cycle.Status is CycleStatus.Decided or CycleStatus.Closed && signedHere)
        {
            packets = await archive.ListAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
            packetJob = await jobs.StatusAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
            int decided = rows.Count(r => r.Proposal.Status is ProposalStatus.Approved or ProposalStatus.Rejected or ProposalStatus.ReturnedForChanges);
            packetsMissing = !packets.Any(p => p.Kind == PacketKind.Cycle) || packets.Count(p => p.Kind == PacketKind.Proposal) < decided;
            packetsExpected = decided + 1;
        }
        bool canSignOff = actor.Has(Role.Reviewer) && cycle.Status is CycleStatus.Open or CycleStatus.InReview && !signOffs.HasSigned(actor.UserId);
        var import = await records.ImportOfAsync(cycleId, cancellationToken).ConfigureAwait(false);
        DecisionStanding? standing = ProposalAccess.CanSeeProposalsOf(actor, cycle)
            ? await decisions.StandingAsync(actor, cycleId, cancellationToken).ConfigureAwait(false)
            : null;
        return new CycleOverview(cycle, marr, rows, signOffs, packets, packetsMissing, packetJob, canSignOff, import)
        {
            Standing = standing,
            PacketsExpected = packetsExpected,
        };
    }
}
