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
    /// decides on what they saw, or not at all. A decision that breaks the board's portfolio rules (a capital limit,
    /// an exclusive or mandatory group, a prerequisite) more than the decisions before it did is refused, unless the
    /// request overrides them with a reason; the decision, its audit event and the cycle packet then record both.
    /// An approval or rejection can be changed until the cycle is signed off, to the other or to a return for changes:
    /// the new decision supersedes the old, and the rules are judged on the set the change leaves.
    /// </summary>
    public Task<Decision> DecideAsync(Actor actor, DecisionRequest request, CancellationToken cancellationToken)
    {
        Check(actor, request);
        return work.RunAsync(async db =>
        {
            CycleDecisions cycle = await CycleDecisions.ForProposalAsync(db, request.ProposalId, request.CycleId, cancellationToken).ConfigureAwait(false);
            if (request.ExpectedRevision is int revision)
            {
                db.Entry(cycle.Proposal(request.ProposalId)).Property(p => p.Revision).OriginalValue = revision;
            }
            DecisionStanding before = cycle.Standing();
            Decision decision = await RecordAsync(db, actor, cycle, request, cancellationToken).ConfigureAwait(false);
            Answer(decision, cycle.Standing().BrokenSince(before), request);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await AuditAsync(db, actor, cycle, decision, cancellationToken).ConfigureAwait(false);
            return decision;
        }, cancellationToken);
    }

    /// <summary>
    /// The rules a decision would break as the request stands, recording nothing: what the page shows before the member
    /// confirms, so that an override is asked for with the rule named. Refuses what <see cref="DecideAsync(Actor, DecisionRequest, CancellationToken)"/> would refuse for any other reason.
    /// </summary>
    public Task<IReadOnlyList<RuleStanding>> PreviewAsync(Actor actor, DecisionRequest request, CancellationToken cancellationToken)
    {
        Check(actor, request);
        return work.ReadAsync<IReadOnlyList<RuleStanding>>(async db =>
        {
            CycleDecisions cycle = await CycleDecisions.ForProposalAsync(db, request.ProposalId, request.CycleId, cancellationToken).ConfigureAwait(false);
            DecisionStanding before = cycle.Standing();
            // Decided in memory only: nothing here is saved.
            cycle.Proposal(request.ProposalId).Decide(actor, request.Outcome, request.Conditions, cycle.Cycle, clock.GetUtcNow(), request.Version);
            return cycle.Standing().BrokenSince(before);
        }, cancellationToken);
    }

    /// <summary>The cycle's decisions as they stand against the board's rules: every budget year's approved first cost against its limit, and each rule.</summary>
    public Task<DecisionStanding> StandingAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators see how a cycle's decisions stand.");
        }
        return work.ReadAsync(async db =>
        {
            CycleDecisions cycle = await CycleDecisions.ForCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            ProposalAccess.RequireProposalsOf(actor, cycle.Cycle, "how the decisions stand");
            return cycle.Standing();
        }, cancellationToken);
    }

    /// <summary>
    /// Records several decisions in one transaction (the selected portfolio's approvals): all or none, the rules checked
    /// on the set they make together.
    /// </summary>
    internal Task<IReadOnlyList<Decision>> DecideAllAsync(Actor actor, int cycleId, IReadOnlyList<DecisionRequest> requests, bool overrideRules, string? overrideReason,
        CancellationToken cancellationToken)
    {
        foreach (DecisionRequest request in requests)
        {
            Check(actor, request);
        }
        return work.RunAsync<IReadOnlyList<Decision>>(async db =>
        {
            CycleDecisions cycle = await CycleDecisions.ForCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            DecisionStanding before = cycle.Standing();
            var decisions = new List<Decision>();
            foreach (DecisionRequest request in requests)
            {
                decisions.Add(await RecordAsync(db, actor, cycle, request, cancellationToken).ConfigureAwait(false));
            }
            var broken = cycle.Standing().BrokenSince(before);
            foreach (Decision decision in decisions)
            {
                Answer(decision, broken, new DecisionRequest(decision.ProposalId, decision.Outcome, null, cycleId, null, null, overrideRules, overrideReason));
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            foreach (Decision decision in decisions)
            {
                await AuditAsync(db, actor, cycle, decision, cancellationToken).ConfigureAwait(false);
            }
            return decisions;
        }, cancellationToken);
    }

    /// <summary>
    /// The rules several decisions recorded together would break (<see cref="DecideAllAsync"/>), recording nothing:
    /// what the page names before the member confirms the selected portfolio, so that an override is asked for.
    /// </summary>
    internal Task<IReadOnlyList<RuleStanding>> PreviewAllAsync(Actor actor, int cycleId, IReadOnlyList<DecisionRequest> requests, CancellationToken cancellationToken)
    {
        foreach (DecisionRequest request in requests)
        {
            Check(actor, request);
        }
        return work.ReadAsync<IReadOnlyList<RuleStanding>>(async db =>
        {
            CycleDecisions cycle = await CycleDecisions.ForCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            DecisionStanding before = cycle.Standing();
            // Decided in memory only: nothing here is saved.
            foreach (DecisionRequest request in requests)
            {
                cycle.Proposal(request.ProposalId).Decide(actor, request.Outcome, request.Conditions, cycle.Cycle, clock.GetUtcNow(), request.Version);
            }
            return cycle.Standing().BrokenSince(before);
        }, cancellationToken);
    }

    private static void Check(Actor actor, DecisionRequest request)
    {
        ArgumentNullException.ThrowIfNull(request);
        ArgumentNullException.ThrowIfNull(actor);
        RequireBoard(actor);
        if (!Enum.IsDefined(request.Outcome))
        {
            throw new RuleViolationException("Choose approve, return for changes or reject.");
        }
        if ((request.Conditions ?? "").Length > 2000)
        {
            throw new RuleViolationException("The conditions are longer than 2,000 characters.");
        }
        if ((request.OverrideReason ?? "").Length > 2000)
        {
            throw new RuleViolationException("The reason for the override is longer than 2,000 characters.");
        }
    }

    /// <summary>Decides the proposal in the cycle's context and adds the decision; saves nothing.</summary>
    private async Task<Decision> RecordAsync(CapReviewDbContext db, Actor actor, CycleDecisions cycle, DecisionRequest request, CancellationToken cancellationToken)
    {
        Proposal proposal = cycle.Proposal(request.ProposalId);
        cycle.RememberBefore(proposal, await db.Decisions.Where(d => d.ProposalId == proposal.Id).OrderByDescending(d => d.Id)
            .Select(d => (int?)d.Id).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false));
        Decision decision = proposal.Decide(actor, request.Outcome, request.Conditions, cycle.Cycle, clock.GetUtcNow(), request.Version);
        db.Decisions.Add(decision);
        return decision;
    }

    /// <summary>Refuses a decision that breaks the rules without an override and its reason; records the override on one that has both.</summary>
    private static void Answer(Decision decision, IReadOnlyList<RuleStanding> broken, DecisionRequest request)
    {
        if (broken.Count == 0)
        {
            return;
        }
        string rules = string.Join("; ", broken.Select(b => b.Words));
        if (!request.Override)
        {
            throw new RuleViolationException($"This decision breaks the board's rules: {rules}. Decide otherwise, or record it with an override and the reason for it.");
        }
        if (string.IsNullOrWhiteSpace(request.OverrideReason))
        {
            throw new RuleViolationException($"Reason for the override: say why the decision stands although it breaks the board's rules ({rules}).");
        }
        decision.RecordOverride(rules, request.OverrideReason);
    }

    private async Task AuditAsync(CapReviewDbContext db, Actor actor, CycleDecisions cycle, Decision decision, CancellationToken cancellationToken)
    {
        Proposal proposal = cycle.Proposal(decision.ProposalId);
        var (status, supersedes) = cycle.Before(proposal);
        await audit.AppendAsync(db, actor, "decision.recorded", "proposal", proposal.Reference,
            new { proposal.Reference, Status = status.ToString() },
            new
            {
                proposal.Reference, Status = proposal.Status.ToString(), decision.VersionNumber, decision.AssumptionsHash, Outcome = decision.Outcome.ToString(), decision.Conditions,
                Supersedes = supersedes, decision.OverriddenRules, decision.OverrideReason,
            },
            cancellationToken).ConfigureAwait(false);
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

    /// <summary>
    /// The decision that sent the proposal back to its lead, while it is back with them: what the lead reads to know
    /// what the board asks for. Null when the proposal is not returned, or was returned without a decision record.
    /// </summary>
    public Task<DecisionView?> ReturnOfAsync(Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync(async db =>
        {
            Proposal proposal = await db.Proposals.SingleOrDefaultAsync(p => p.Id == proposalId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such proposal.");
            CycleStatus? cycleStatus = proposal.BudgetCycleId is int cycleId
                ? await db.BudgetCycles.Where(c => c.Id == cycleId).Select(c => (CycleStatus?)c.Status).SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false)
                : null;
            if (!ProposalAccess.CanSee(actor, proposal, cycleStatus))
            {
                throw new NotFoundException("There is no such proposal.");
            }
            if (proposal.Status != ProposalStatus.ReturnedForChanges)
            {
                return null;
            }
            Decision? last = await db.Decisions.Where(d => d.ProposalId == proposalId).OrderByDescending(d => d.Id).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false);
            return last is { Outcome: DecisionOutcome.ReturnForChanges } ? DecisionView.Of(last, proposal.Reference) : null;
        }, cancellationToken);
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
            // Each decision with the next one on its proposal, which supersedes it.
            int? Next(Decision d) => decisions.Where(e => e.ProposalId == d.ProposalId && e.Id > d.Id).Select(e => (int?)e.Id).FirstOrDefault();
            return [.. decisions.Where(d => visible.ContainsKey(d.ProposalId)).Select(d => DecisionView.Of(d, visible[d.ProposalId], Next(d)))];
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
