using System.Globalization;
using System.Text.Json;
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
            if (proposal.Status is not (ProposalStatus.Submitted or ProposalStatus.InReview) || proposal.BudgetCycleId is not int cycleId)
            {
                throw new RuleViolationException("Only a submitted proposal can be decided.");
            }
            BudgetCycle cycle = await db.BudgetCycles.SingleAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false);
            if (cycle.Status is CycleStatus.Decided or CycleStatus.Closed)
            {
                throw new RuleViolationException($"The cycle {cycle.Name} is already decided.");
            }
            ProposalVersion version = proposal.Versions.Where(v => v.IsFrozen).OrderBy(v => v.Number).Last();
            if (expectedVersion is int judged && judged != version.Number)
            {
                throw new ConcurrencyConflictException($"version: {proposal.Reference} was decided on version {judged}, but its latest submitted version is {version.Number}. Look at version {version.Number} and decide again.");
            }
            object before = new { proposal.Reference, Status = proposal.Status.ToString() };
            if (expectedRevision is int revision)
            {
                db.Entry(proposal).Property(p => p.Revision).OriginalValue = revision;
            }
            // A decision on a proposal not yet in review passes through review: the workflow's path stays whole.
            ProposalStatus from = proposal.Status == ProposalStatus.Submitted ? ProposalStatus.InReview : proposal.Status;
            ProposalStatus to = outcome switch
            {
                DecisionOutcome.Approve => ProposalStatus.Approved,
                DecisionOutcome.Reject => ProposalStatus.Rejected,
                _ => ProposalStatus.ReturnedForChanges,
            };
            if (ProposalWorkflow.RoleFor(from, to) != Role.Reviewer)
            {
                throw new RuleViolationException("The workflow does not allow this decision now.");
            }
            proposal.Status = to;
            proposal.Revision++;
            var decision = new Decision
            {
                ProposalId = proposal.Id,
                BudgetCycleId = cycleId,
                VersionNumber = version.Number,
                AssumptionsHash = version.AssumptionsHash,
                MarrPolicyVersionId = cycle.MarrPolicyVersionId,
                Outcome = outcome,
                Conditions = (conditions ?? "").Trim(),
                DecidedBy = actor.UserId,
                DecidedAt = clock.GetUtcNow(),
            };
            db.Decisions.Add(decision);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "decision.recorded", "proposal", proposal.Reference, before,
                new { proposal.Reference, Status = proposal.Status.ToString(), decision.VersionNumber, decision.AssumptionsHash, Outcome = outcome.ToString(), decision.Conditions },
                cancellationToken).ConfigureAwait(false);
            return decision;
        }, cancellationToken);
    }

    /// <summary>
    /// Signs off every decision of the cycle; the last required sign-off makes the cycle decided and queues the making of
    /// its packets in the same transaction (<see cref="Records.PacketJobs"/>), whoever signs and through whichever face.
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
            if (cycle.Status is CycleStatus.Decided or CycleStatus.Closed)
            {
                throw new RuleViolationException($"The cycle {cycle.Name} is already decided.");
            }
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            var open = proposals.Where(p => p.Status is ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.ReturnedForChanges).ToList();
            if (proposals.Count == 0 || open.Count > 0)
            {
                throw new RuleViolationException(proposals.Count == 0
                    ? "The cycle has no proposals to sign off."
                    : $"Decide every proposal first: {string.Join(", ", open.Select(p => p.Reference))} still open.");
            }
            if (await db.SignOffs.AnyAsync(s => s.BudgetCycleId == cycleId && s.UserId == actor.UserId, cancellationToken).ConfigureAwait(false))
            {
                throw new RuleViolationException("You have already signed off this cycle.");
            }
            var ids = proposals.Select(p => p.Id).ToList();
            var latest = (await db.Decisions.Where(d => ids.Contains(d.ProposalId)).ToListAsync(cancellationToken).ConfigureAwait(false))
                .GroupBy(d => d.ProposalId).Select(g => g.OrderBy(d => d.Id).Last()).ToList();
            var signed = latest.Join(proposals, d => d.ProposalId, p => p.Id, (d, p) => new
            {
                Proposal = p.Reference,
                Version = d.VersionNumber,
                d.AssumptionsHash,
                Outcome = d.Outcome.ToString(),
            }).OrderBy(x => x.Proposal, StringComparer.Ordinal).ToArray();
            var signOff = new SignOff
            {
                BudgetCycleId = cycleId,
                UserId = actor.UserId,
                DisplayName = actor.DisplayName,
                SignedAt = clock.GetUtcNow(),
                DecisionsSigned = JsonSerializer.Serialize(signed),
            };
            db.SignOffs.Add(signOff);
            int count = await db.SignOffs.CountAsync(s => s.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false) + 1;
            string cycleBefore = cycle.Status.ToString();
            if (count >= cycle.RequiredSignOffs)
            {
                cycle.Status = CycleStatus.Decided;
                cycle.Revision++;
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
            if (!await db.BudgetCycles.AnyAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false))
            {
                throw new NotFoundException("There is no such budget cycle.");
            }
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            var visible = proposals.Where(p => ProposalAccess.CanSee(actor, p)).ToDictionary(p => p.Id, p => p.Reference);
            var decisions = await db.Decisions.Where(d => d.BudgetCycleId == cycleId).OrderBy(d => d.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            return [.. decisions.Where(d => visible.ContainsKey(d.ProposalId)).Select(d => DecisionView.Of(d, visible[d.ProposalId]))];
        }, cancellationToken);
    }

    /// <summary>The sign-offs of a cycle, for the board, finance and administrators.</summary>
    public Task<IReadOnlyList<SignOff>> SignOffsAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators see a cycle's sign-offs.");
        }
        return work.ReadAsync<IReadOnlyList<SignOff>>(async db =>
        {
            if (!await db.BudgetCycles.AnyAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false))
            {
                throw new NotFoundException("There is no such budget cycle.");
            }
            return await db.SignOffs.Where(s => s.BudgetCycleId == cycleId).OrderBy(s => s.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    private static void RequireBoard(Actor actor)
    {
        if (!actor.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
    }
}
