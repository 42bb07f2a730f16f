using CapReview.Reviews.Access;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Tests;

/// <summary>
/// The proposal workflow as the board agreed it, written out here and never read from <see cref="ProposalWorkflow"/>,
/// so that a mistaken edit of the production table fails these tests instead of moving them along with it.
/// </summary>
internal static class WorkflowTable
{
    /// <summary>Every allowed move and the role that makes it; every pair not listed is refused to everyone.</summary>
    public static readonly (ProposalStatus From, ProposalStatus To, Role By)[] Allowed =
    [
        (ProposalStatus.Draft, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.ReturnedForChanges, ProposalStatus.Submitted, Role.ProjectLead),
        // Issue 17: a revision made while the board has the proposal is resubmitted in place of the version under review.
        (ProposalStatus.Submitted, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.InReview, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.Approved, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.Rejected, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.Draft, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.Submitted, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.ReturnedForChanges, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.Submitted, ProposalStatus.InReview, Role.Reviewer),
        (ProposalStatus.Submitted, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.Approved, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.Rejected, Role.Reviewer),
        // A decision changed before the cycle is signed off (issue 17).
        (ProposalStatus.Approved, ProposalStatus.Rejected, Role.Reviewer),
        (ProposalStatus.Rejected, ProposalStatus.Approved, Role.Reviewer),
        // … or to a return for changes, recorded as a decision that supersedes the one before.
        (ProposalStatus.Approved, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.Rejected, ProposalStatus.ReturnedForChanges, Role.Reviewer),
    ];

    /// <summary>The role the agreed table names for a move, or null when the move is not in it.</summary>
    public static Role? RoleFor(ProposalStatus from, ProposalStatus to) =>
        Allowed.Where(t => t.From == from && t.To == to).Select(t => (Role?)t.By).SingleOrDefault();

    /// <summary>
    /// Whether <paramref name="actor"/> may move a proposal owned by <paramref name="ownerId"/>: the table's role and,
    /// for a lead's move, the proposal's own lead. A decision on a submitted proposal passes through review first.
    /// </summary>
    public static bool Permits(ProposalStatus from, ProposalStatus to, Actor actor, string ownerId)
    {
        bool decision = to is ProposalStatus.Approved or ProposalStatus.Rejected;
        Role? role = RoleFor(decision && from == ProposalStatus.Submitted ? ProposalStatus.InReview : from, to);
        return role is Role needed && actor.Has(needed) && (needed != Role.ProjectLead || actor.UserId == ownerId);
    }
}
