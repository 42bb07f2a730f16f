using CapReview.Reviews.Access;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Who may see a proposal: its owner and administrators always; board members once it has been submitted to a cycle;
/// finance once it is decided. Anyone else is told it does not exist.
/// </summary>
public static class ProposalAccess
{
    public static bool CanSee(Actor actor, Proposal proposal)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(proposal);
        return actor.Has(Role.Administrator)
            || proposal.OwnerId == actor.UserId
            || (actor.Has(Role.Reviewer) && proposal.BudgetCycleId is not null)
            || (actor.Has(Role.Finance) && proposal.Status is ProposalStatus.Approved or ProposalStatus.Rejected);
    }
}
