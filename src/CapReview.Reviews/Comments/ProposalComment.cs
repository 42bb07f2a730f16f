namespace CapReview.Reviews.Comments;

/// <summary>A remark on a proposal by its lead or a board member, on the version that was current. Written once.</summary>
public sealed class ProposalComment
{
    public int Id { get; set; }

    public int ProposalId { get; set; }

    public int VersionNumber { get; set; }

    public required string AuthorId { get; set; }

    public required string AuthorName { get; set; }

    public DateTimeOffset At { get; set; }

    public required string Text { get; set; }
}
