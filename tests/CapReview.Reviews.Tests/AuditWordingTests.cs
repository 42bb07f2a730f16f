using CapReview.Reviews.Audit;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Tests;

/// <summary>The trail's page and CSV say what happened in words, never the stored action's dotted name.</summary>
public sealed class AuditWordingTests
{
    [Theory]
    [InlineData("decision.recorded", "Decision recorded")]
    [InlineData("proposal.revision-started", "Revision started under review")]
    [InlineData("cycle.corrected", "Cycle's dates or limit corrected")]
    [InlineData("marr.version-retired", "MARR version retired")]
    [InlineData("user.two-step-reset", "Two-step sign-in reset")]
    [InlineData("token.revoked", "Token revoked")]
    public void An_action_reads_in_words(string action, string words) => Assert.Equal(words, AuditWording.Of(action));

    [Theory]
    [InlineData(ProposalStatus.Submitted, "Proposal submitted")]
    [InlineData(ProposalStatus.InReview, "Proposal taken into review")]
    [InlineData(ProposalStatus.Approved, "Proposal approved")]
    [InlineData(ProposalStatus.ReturnedForChanges, "Proposal returned for changes")]
    [InlineData(ProposalStatus.Rejected, "Proposal rejected")]
    [InlineData(ProposalStatus.Withdrawn, "Proposal withdrawn")]
    public void Each_move_of_a_proposal_reads_in_words(ProposalStatus to, string words) =>
        // ProposalService records a move as "proposal." and the status in lower case.
        Assert.Equal(words, AuditWording.Of("proposal." + to.ToString().ToLowerInvariant()));
}
