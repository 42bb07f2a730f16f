using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// The allowed transitions of a proposal and the role each needs; everything else is refused. A project lead acts only on
/// their own proposals (checked by the service). The moves back to submitted from submitted, in review, approved and
/// rejected are a lead's resubmission of a revision made while the cycle is undecided (<see cref="Proposal.Submit"/>
/// refuses them once the cycle is decided, and without a revision to submit).
/// </summary>
public static class ProposalWorkflow
{
    public static IReadOnlyList<(ProposalStatus From, ProposalStatus To, Role By)> Transitions { get; } =
    [
        (ProposalStatus.Draft, ProposalStatus.Submitted, Role.ProjectLead),
        (ProposalStatus.ReturnedForChanges, ProposalStatus.Submitted, Role.ProjectLead),
        // A revision made while the board reviews replaces the version under review: back to submitted, decided afresh.
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
        // A decision changed before the cycle is signed off: a new decision supersedes the old one.
        (ProposalStatus.Approved, ProposalStatus.Rejected, Role.Reviewer),
        (ProposalStatus.Rejected, ProposalStatus.Approved, Role.Reviewer),
        // … or to a return for changes, which sends the proposal back to its lead (only as a decision: Proposal.Decide).
        (ProposalStatus.Approved, ProposalStatus.ReturnedForChanges, Role.Reviewer),
        (ProposalStatus.Rejected, ProposalStatus.ReturnedForChanges, Role.Reviewer),
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

    /// <summary>
    /// Whether the lead may change the proposal's assumptions: a draft or a proposal returned for changes always; a
    /// submitted one (in review, or decided while its cycle is not) while its cycle is open or in review, as a revision
    /// that waits beside the version under review until it is resubmitted. A withdrawn proposal, or one whose cycle is
    /// decided, never.
    /// </summary>
    public static bool IsEditable(ProposalStatus status, CycleStatus? cycleStatus) => status switch
    {
        ProposalStatus.Draft or ProposalStatus.ReturnedForChanges => true,
        ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.Approved or ProposalStatus.Rejected =>
            cycleStatus is CycleStatus.Open or CycleStatus.InReview,
        _ => false,
    };

    /// <summary>Whether the board has the proposal before it: submitted, in review, or decided in a cycle not yet signed off.</summary>
    public static bool IsBeforeTheBoard(ProposalStatus status) =>
        status is ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.Approved or ProposalStatus.Rejected;
}
