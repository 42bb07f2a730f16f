namespace CapReview.Reviews.Proposals;

/// <summary>A proposal's status as the workflow's messages say it ("in review", not "InReview").</summary>
public static class ProposalStatusWords
{
    public static string Describe(ProposalStatus status) => status switch
    {
        ProposalStatus.InReview => "in review",
        ProposalStatus.ReturnedForChanges => "returned for changes",
        _ => status.ToString().ToLowerInvariant(),
    };
}
