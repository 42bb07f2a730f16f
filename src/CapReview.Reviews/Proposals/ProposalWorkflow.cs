using CapReview.Reviews.Access;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// The allowed transitions of a proposal and the role each needs; everything else is refused. A project lead acts only on
/// their own proposals (checked by the service).
/// </summary>
public static class ProposalWorkflow
{
    public static IReadOnlyList<(ProposalStatus From, ProposalStatus To, Role By)> Transitions { get; } =
    [
        (ProposalStatus.Draft, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.ReturnedForChanges, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.Draft, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.Submitted, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.ReturnedForChanges, ProposalStatus.Withdrawn, Role.ProjectLead),
        (ProposalStatus.Submitted, ProposalStatus.InReview, Role.Reviewer),
        (ProposalStatus.Submitted, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.Approved, Role.Reviewer),
        (ProposalStatus.InReview, ProposalStatus.Rejected, Role.Reviewer),
        // A decision changed before the cycle is signed off: a new decision supersedes the old one.
        (ProposalStatus.Approved, ProposalStatus.Rejected, Role.Reviewer),
        (ProposalStatus.Rejected, ProposalStatus.Approved, Role.Reviewer),
    ];

    /// <summary>The role a transition needs, or null when the transition does not exist.</summary>
    public static Role? RoleFor(ProposalStatus from, ProposalStatus to)
    {
        foreach (var (f, t, by) in Transitions)
        {
            if (f == from && t == to)
            {
                return by;
            }
        }
        return null;
    }
}
