using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// The board's part: deciding each submitted proposal of a cycle on its latest frozen version, and signing off the
/// cycle once every proposal is decided. With the configured number of sign-offs the cycle is decided.
/// </summary>
public sealed class DecisionService(ReviewWork work, AuditTrail audit, TimeProvider clock, Records.PacketJobs packetJobs)
{
    public Task<Decision> DecideAsync(Actor actor, int proposalId, DecisionOutcome outcome, string conditions, int expectedRevision, CancellationToken cancellationToken) =>
        DecideAsync(actor, new DecisionRequest(proposalId, outcome, conditions, null, null, expectedRevision), cancellationToken);

    /// <summary>
    /// Records the board's decision on a proposal. Where the request names the cycle and the version the member
    /// judged, a proposal of another cycle is not found and a later submitted version is a conflict: the member
    /// decides on what they saw, or not at all.
    /// </summary>
    public Task<Decision> DecideAsync(Actor actor, DecisionRequest request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(actor);
        var (proposalId, outcome, conditions, expectedCycle, expectedVersion, expectedRevision) = request;
        RequireBoard(actor);
        if (!Enum.IsDefined(outcome))
        {
            throw new RuleViolationException("Choose approve, return for changes or reject.");
        }
        if ((conditions ?? "").Length > 2000)
        {
            throw new RuleViolationException("The conditions are longer than 2,000 characters.");
        }
        return work.RunAsync(async db =>
        {
            Proposal proposal = await db.Proposals.Include(p => p.Versions).SingleOrDefaultAsync(p => p.Id == proposalId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such proposal.");
            if (expectedCycle is int named && named != proposal.BudgetCycleId)
            {
                throw new NotFoundException("There is no such proposal in this cycle.");
            }
            // The cycle it was submitted to, if any: the proposal refuses a decision without one.
            BudgetCycle? cycle = proposal.BudgetCycleId is int cycleId
                ? await db.BudgetCycles.SingleAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                : null;
            object before = new { proposal.Reference, Status = proposal.Status.ToString() };
            if (expectedRevision is int revision)
            {
                db.Entry(proposal).Property(p => p.Revision).OriginalValue = revision;
            }
            Decision decision = proposal.Decide(actor, outcome, conditions, cycle, clock.GetUtcNow(), expectedVersion);
            db.Decisions.Add(decision);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "decision.recorded", "proposal", proposal.Reference, before,
                new { proposal.Reference, Status = proposal.Status.ToString(), decision.VersionNumber, decision.AssumptionsHash, Outcome = outcome.ToString(), decision.Conditions },
                cancellationToken).ConfigureAwait(false);
            return decision;
        }, cancellationToken);
    }

    /// <summary>
    /// Signs off every decision of the cycle as they stand (<see cref="CycleSignOffs"/>): the last required sign-off of
    /// that same set makes the cycle decided and queues the making of its packets in the same transaction
    /// (<see cref="Records.PacketJobs"/>), whoever signs and through whichever face.
    /// </summary>
    public async Task<SignOff> SignOffAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        RequireBoard(actor);
        bool decided = false;
        SignOff result = await work.RunAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            CycleSignOffs before = await ReadSignOffsAsync(db, cycleId, proposals, cancellationToken).ConfigureAwait(false);
            var signed = before.Decisions;
            string cycleBefore = cycle.Status.ToString();
            SignOff signOff = cycle.SignOff(actor, proposals, before.HasSigned(actor.UserId), before.Current.Count, SignedDecision.Serialize(signed), clock.GetUtcNow());
            db.SignOffs.Add(signOff);
            int count = before.Current.Count + 1;
            if (cycle.Status == CycleStatus.Decided)
            {
                await Records.PacketJobs.QueueAsync(db, cycleId, actor, signOff.SignedAt, cancellationToken).ConfigureAwait(false);
                decided = true;
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.signed-off", "budget_cycle", cycleId.ToString(CultureInfo.InvariantCulture),
                new { Status = cycleBefore }, new { Status = cycle.Status.ToString(), SignOffs = count, Decisions = signed }, cancellationToken).ConfigureAwait(false);
            return signOff;
        }, cancellationToken).ConfigureAwait(false);
        if (decided)
        {
            packetJobs.Wake();
        }
        return result;
    }

    /// <summary>The decisions of a cycle in the order they were made, on the proposals the actor may see.</summary>
    public Task<IReadOnlyList<DecisionView>> DecisionsAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync<IReadOnlyList<DecisionView>>(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            var visible = proposals.Where(p => ProposalAccess.CanSee(actor, p, cycle.Status)).ToDictionary(p => p.Id, p => p.Reference);
            var decisions = await db.Decisions.Where(d => d.BudgetCycleId == cycleId).OrderBy(d => d.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            return [.. decisions.Where(d => visible.ContainsKey(d.ProposalId)).Select(d => DecisionView.Of(d, visible[d.ProposalId]))];
        }, cancellationToken);
    }

    /// <summary>The sign-offs of a cycle by what they count for (<see cref="CycleSignOffs"/>), for the board, finance and administrators.</summary>
    public Task<CycleSignOffs> SignOffsAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators see a cycle's sign-offs.");
        }
        return work.ReadAsync(async db =>
        {
            if (!await db.BudgetCycles.AnyAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false))
            {
                throw new NotFoundException("There is no such budget cycle.");
            }
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            return await ReadSignOffsAsync(db, cycleId, proposals, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    /// <summary>The cycle's sign-offs against the set of decisions its proposals have now.</summary>
    internal static async Task<CycleSignOffs> ReadSignOffsAsync(CapReviewDbContext db, int cycleId, IReadOnlyCollection<Proposal> proposals, CancellationToken cancellationToken)
    {
        var ids = proposals.Select(p => p.Id).ToList();
        var decisions = await db.Decisions.Where(d => ids.Contains(d.ProposalId)).ToListAsync(cancellationToken).ConfigureAwait(false);
        var signOffs = await db.SignOffs.Where(s => s.BudgetCycleId == cycleId).OrderBy(s => s.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
        var frozen = await db.ProposalVersions.Where(v => ids.Contains(v.ProposalId) && v.IsFrozen)
            .Select(v => new { v.ProposalId, v.Number }).ToListAsync(cancellationToken).ConfigureAwait(false);
        var underReview = frozen.GroupBy(v => v.ProposalId).ToDictionary(g => g.Key, g => g.Max(v => v.Number));
        return CycleSignOffs.Of(signOffs, SignedDecision.SetOf(proposals, decisions, underReview));
    }

    private static void RequireBoard(Actor actor)
    {
        if (!actor.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
    }
}
