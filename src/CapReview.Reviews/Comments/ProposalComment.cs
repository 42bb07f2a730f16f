namespace CapReview.Reviews.Comments;

/// <summary>A remark on a proposal by its lead or a board member, on the version that was current. Written once.</summary>
public sealed class ProposalComment
{
    private ProposalComment()
    {
    }

    public ProposalComment(int proposalId, int versionNumber, string authorId, string authorName, DateTimeOffset at, string text)
    {
        ProposalId = proposalId;
        VersionNumber = versionNumber;
        AuthorId = authorId;
        AuthorName = authorName;
        At = at;
        Text = text;
    }

    public int Id { get; private set; }

    public int ProposalId { get; private set; }

    public int VersionNumber { get; private set; }

    public string AuthorId { get; private set; } = "";

    public string AuthorName { get; private set; } = "";

    public DateTimeOffset At { get; private set; }

    public string Text { get; private set; } = "";
}
