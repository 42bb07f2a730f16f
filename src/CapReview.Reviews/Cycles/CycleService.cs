using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Cycles;

/// <summary>Budget cycles: administrators open them, each pinned to one MARR policy version.</summary>
public sealed class CycleService(ReviewWork work, AuditTrail audit)
{
    public Task<BudgetCycle> CreateAsync(Actor actor, NewBudgetCycle cycle, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(cycle);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can open a budget cycle.");
        }
        BudgetCycle.CheckTerms(cycle);
        return work.RunAsync(async db =>
        {
            if (!await db.MarrPolicyVersions.AnyAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false))
            {
                throw new NotFoundException("There is no such MARR policy version.");
            }
            if (await db.MarrVersionRetirements.AnyAsync(r => r.MarrPolicyVersionId == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false))
            {
                throw new RuleViolationException("marrPolicyVersionId: that MARR version was retired as a mistake; choose another.");
            }
            if (await db.BudgetCycles.AnyAsync(c => c.Name == cycle.Name.Trim(), cancellationToken).ConfigureAwait(false))
            {
                throw new RuleViolationException($"There is already a cycle called {cycle.Name.Trim()}.");
            }
            var entity = BudgetCycle.Open(cycle);
            db.BudgetCycles.Add(entity);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.created", "budget_cycle", entity.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), null, cycle, cancellationToken).ConfigureAwait(false);
            return entity;
        }, cancellationToken);
    }

    /// <summary>
    /// An administrator moves a cycle on: an open cycle goes into review (no more submissions), a decided one is closed.
    /// A cycle becomes decided only through its sign-offs.
    /// </summary>
    public Task<BudgetCycle> MoveAsync(Actor actor, int cycleId, CycleStatus to, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can move a cycle on.");
        }
        return work.RunAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            string before = cycle.Status.ToString();
            db.Entry(cycle).Property(c => c.Revision).OriginalValue = expectedRevision;
            switch (to)
            {
                case CycleStatus.InReview:
                    cycle.StartReview(actor);
                    break;
                case CycleStatus.Closed:
                    cycle.Close(actor);
                    break;
                case CycleStatus.Decided:
                    throw new RuleViolationException("A cycle is decided by its board sign-offs.");
                default:
                    throw new RuleViolationException($"A cycle that is {cycle.Status} cannot become {to}.");
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.moved", "budget_cycle", cycle.Id.ToString(System.Globalization.CultureInfo.InvariantCulture),
                new { Status = before }, new { Status = to.ToString() }, cancellationToken).ConfigureAwait(false);
            return cycle;
        }, cancellationToken);
    }

    /// <summary>
    /// An administrator corrects an open cycle's dates and capital limit (a typing mistake, a date moved by the board);
    /// audited with the terms before and after. Once the review has started the terms stand.
    /// </summary>
    public Task<BudgetCycle> CorrectAsync(Actor actor, int cycleId, CycleCorrection correction, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(correction);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can correct a cycle.");
        }
        return work.RunAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var before = CycleCorrection.Of(cycle);
            db.Entry(cycle).Property(c => c.Revision).OriginalValue = expectedRevision;
            cycle.Correct(actor, correction);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.corrected", "budget_cycle", cycle.Id.ToString(System.Globalization.CultureInfo.InvariantCulture),
                before, correction, cancellationToken).ConfigureAwait(false);
            return cycle;
        }, cancellationToken);
    }

    /// <summary>The cycle and the MARR policy version it is pinned to.</summary>
    public Task<(BudgetCycle Cycle, Marr.MarrPolicyVersion Marr)> GetAsync(int cycleId, CancellationToken cancellationToken) =>
        work.ReadAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            var marr = await db.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false);
            return (cycle, marr);
        }, cancellationToken);

    public Task<IReadOnlyList<BudgetCycle>> ListAsync(CancellationToken cancellationToken) =>
        work.ReadAsync<IReadOnlyList<BudgetCycle>>(async db =>
            await db.BudgetCycles.OrderByDescending(c => c.OpensOn).ToListAsync(cancellationToken).ConfigureAwait(false), cancellationToken);
}

/// <summary>A new budget cycle as an administrator enters it.</summary>
public sealed record NewBudgetCycle(string Name, decimal CapitalLimit, int MarrPolicyVersionId, DateOnly OpensOn, DateOnly ClosesOn, int RequiredSignOffs = 2);
