namespace CapReview.Reviews.Proposals;

/// <summary>Where a proposal stands in the review workflow.</summary>
public enum ProposalStatus
{
    Draft,
    Submitted,
    InReview,
    Approved,
    ReturnedForChanges,
    Rejected,
    Withdrawn,
}
