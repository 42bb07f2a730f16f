using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Records;

/// <summary>
/// What a decided cycle's record holds: the cycle, its MARR, the sign-offs of the decisions as they stand (given here)
/// and each proposal's latest decision; for an imported cycle, where it came from.
/// </summary>
public sealed record CycleRecord(BudgetCycle Cycle, MarrPolicyVersion Marr, IReadOnlyList<SignOff> SignOffs, IReadOnlyList<(ProposalView Proposal, Decision Decision)> Decided,
    Interchange.CycleImport? Import = null)
{
    /// <summary>Whether this installation's board decided it: the required members here signed the decisions as they stand.</summary>
    public bool SignedHere => SignOffs.Count >= Cycle.RequiredSignOffs;

    /// <summary>Why a cycle decided elsewhere (imported already decided) has no packets here.</summary>
    public static string NotSignedHere(string cycleName) =>
        $"The decisions of {cycleName} were imported from another installation's document and not signed off here: this installation signs no packets for them.";
}

/// <summary>Reads the record of a cycle for its packets.</summary>
public sealed class DecisionRecords(ReviewWork work)
{
    /// <summary>Where a cycle was imported from, or null for a cycle opened here.</summary>
    public Task<Interchange.CycleImport?> ImportOfAsync(int cycleId, CancellationToken cancellationToken) =>
        work.ReadAsync(db => db.CycleImports.AsNoTracking().SingleOrDefaultAsync(i => i.BudgetCycleId == cycleId, cancellationToken), cancellationToken);

    public Task<CycleRecord> ForCycleAsync(int cycleId, CancellationToken cancellationToken) =>
        work.ReadAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var marr = await db.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false);
            var proposals = await db.Proposals.Include(p => p.Versions).Where(p => p.BudgetCycleId == cycleId).OrderBy(p => p.Id)
                .ToListAsync(cancellationToken).ConfigureAwait(false);
            var ids = proposals.Select(p => p.Id).ToList();
            var latest = (await db.Decisions.Where(d => ids.Contains(d.ProposalId)).ToListAsync(cancellationToken).ConfigureAwait(false))
                .GroupBy(d => d.ProposalId).ToDictionary(g => g.Key, g => g.OrderBy(d => d.Id).Last());
            // Those who signed the set that decided the cycle, not an earlier set nor an imported record.
            var signOffs = (await DecisionService.ReadSignOffsAsync(db, cycleId, proposals, cancellationToken).ConfigureAwait(false)).Current;
            var decided = proposals.Where(p => latest.ContainsKey(p.Id)).Select(p => (ProposalView.Of(p), latest[p.Id])).ToList();
            var import = await db.CycleImports.SingleOrDefaultAsync(i => i.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
            return new CycleRecord(cycle, marr, signOffs, decided, import);
        }, cancellationToken);
}
