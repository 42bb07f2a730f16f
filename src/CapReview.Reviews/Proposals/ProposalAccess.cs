using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Who may see a proposal: its owner and administrators always; board members once it has been submitted to a cycle;
/// finance once it is decided and its cycle is decided too (every required sign-off given) or closed. Anyone else is
/// told it does not exist. A cycle's proposals as a whole (its ranking, portfolio, portfolio rules and their exports)
/// follow the same rule: the board and administrators at every stage, finance once the cycle is decided.
/// </summary>
public static class ProposalAccess
{
    public static bool CanSee(Actor actor, Proposal proposal, CycleStatus? cycleStatus)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(proposal);
        return actor.Has(Role.Administrator)
            || proposal.OwnerId == actor.UserId
            || (actor.Has(Role.Reviewer) && proposal.BudgetCycleId is not null)
            || (actor.Has(Role.Finance) && proposal.Status is ProposalStatus.Approved or ProposalStatus.Rejected && IsSettled(cycleStatus));
    }

    /// <summary>Whether the actor may see the proposals of the cycle together: the ranking, the portfolio and the rules between them.</summary>
    public static bool CanSeeProposalsOf(Actor actor, BudgetCycle cycle)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(cycle);
        return actor.Has(Role.Reviewer) || actor.Has(Role.Administrator) || (actor.Has(Role.Finance) && IsSettled(cycle.Status));
    }

    /// <summary>Refuses, with the reason in words, an actor who may not see the cycle's proposals together (<see cref="CanSeeProposalsOf"/>).</summary>
    public static void RequireProposalsOf(Actor actor, BudgetCycle cycle, string what)
    {
        if (CanSeeProposalsOf(actor, cycle))
        {
            return;
        }
        throw new AccessDeniedException(actor.Has(Role.Finance)
            ? $"Finance sees {what} of the cycle {cycle.Name} once the board has decided it; it is {InWords(cycle.Status)}."
            : $"Only the review board, finance and administrators see {what} of a cycle.");
    }

    /// <summary><see cref="CanSee"/> with the status of the proposal's cycle read from <paramref name="db"/>.</summary>
    internal static async Task<bool> CanSeeAsync(CapReviewDbContext db, Actor actor, Proposal proposal, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        CycleStatus? status = proposal.BudgetCycleId is int cycleId
            ? await db.BudgetCycles.Where(c => c.Id == cycleId).Select(c => (CycleStatus?)c.Status).SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false)
            : null;
        return CanSee(actor, proposal, status);
    }

    /// <summary>Decided by the board's sign-offs, or closed since.</summary>
    private static bool IsSettled(CycleStatus? status) => status is CycleStatus.Decided or CycleStatus.Closed;

    private static string InWords(CycleStatus status) => status switch
    {
        CycleStatus.Open => "still open",
        CycleStatus.InReview => "still in review",
        _ => status.ToString().ToLowerInvariant(),
    };
}
