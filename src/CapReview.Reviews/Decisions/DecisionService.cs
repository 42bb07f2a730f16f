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
public sealed class DecisionService(ReviewWork work, AuditTrail audit, TimeProvider clock)
{
    public Task<Decision> DecideAsync(Actor actor, int proposalId, DecisionOutcome outcome, string conditions, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
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
            // The cycle it was submitted to, if any: the proposal refuses a decision without one.
            BudgetCycle? cycle = proposal.BudgetCycleId is int cycleId
                ? await db.BudgetCycles.SingleAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                : null;
            object before = new { proposal.Reference, Status = proposal.Status.ToString() };
            db.Entry(proposal).Property(p => p.Revision).OriginalValue = expectedRevision;
            Decision decision = proposal.Decide(actor, outcome, conditions, cycle, clock.GetUtcNow());
            db.Decisions.Add(decision);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "decision.recorded", "proposal", proposal.Reference, before,
                new { proposal.Reference, Status = proposal.Status.ToString(), decision.VersionNumber, decision.AssumptionsHash, Outcome = outcome.ToString(), decision.Conditions },
                cancellationToken).ConfigureAwait(false);
            return decision;
        }, cancellationToken);
    }

    /// <summary>Signs off every decision of the cycle; the last required sign-off makes the cycle decided.</summary>
    public Task<SignOff> SignOffAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        RequireBoard(actor);
        return work.RunAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var proposals = await db.Proposals.Where(p => p.BudgetCycleId == cycleId).ToListAsync(cancellationToken).ConfigureAwait(false);
            bool alreadySigned = await db.SignOffs.AnyAsync(s => s.BudgetCycleId == cycleId && s.UserId == actor.UserId, cancellationToken).ConfigureAwait(false);
            int signOffsBefore = await db.SignOffs.CountAsync(s => s.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
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
            string cycleBefore = cycle.Status.ToString();
            SignOff signOff = cycle.SignOff(actor, proposals, alreadySigned, signOffsBefore, JsonSerializer.Serialize(signed), clock.GetUtcNow());
            db.SignOffs.Add(signOff);
            int count = signOffsBefore + 1;
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.signed-off", "budget_cycle", cycleId.ToString(CultureInfo.InvariantCulture),
                new { Status = cycleBefore }, new { Status = cycle.Status.ToString(), SignOffs = count, Decisions = signed }, cancellationToken).ConfigureAwait(false);
            return signOff;
        }, cancellationToken);
    }

    public Task<IReadOnlyList<SignOff>> SignOffsAsync(int cycleId, CancellationToken cancellationToken) =>
        work.ReadAsync<IReadOnlyList<SignOff>>(async db =>
            await db.SignOffs.Where(s => s.BudgetCycleId == cycleId).OrderBy(s => s.Id).ToListAsync(cancellationToken).ConfigureAwait(false), cancellationToken);

    private static void RequireBoard(Actor actor)
    {
        if (!actor.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
    }
}
