using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Comments;

/// <summary>The discussion of a proposal: anyone who may see it may read it; its lead and board members may add to it.</summary>
public sealed class CommentService(ReviewWork work, AuditTrail audit, TimeProvider clock)
{
    public const int MaxLength = 2000;

    public Task<ProposalComment> AddAsync(Actor actor, int proposalId, string text, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (string.IsNullOrWhiteSpace(text))
        {
            throw new RuleViolationException("text: write the comment first.");
        }
        if (text.Length > MaxLength)
        {
            throw new RuleViolationException("text: a comment holds at most 2,000 characters.");
        }
        return work.RunAsync(async db =>
        {
            Proposal proposal = await VisibleAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            if (proposal.OwnerId != actor.UserId && !actor.Has(Role.Reviewer))
            {
                throw new AccessDeniedException("Only the proposal's lead and board members can comment.");
            }
            var comment = new ProposalComment(proposal.Id, proposal.Latest.Number, actor.UserId, actor.DisplayName, clock.GetUtcNow(), text.Trim());
            db.Comments.Add(comment);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "comment.added", "proposal", proposal.Reference, null,
                new { comment.VersionNumber, comment.Text }, cancellationToken).ConfigureAwait(false);
            return comment;
        }, cancellationToken);
    }

    public Task<IReadOnlyList<ProposalComment>> ListAsync(Actor actor, int proposalId, CancellationToken cancellationToken) =>
        work.ReadAsync<IReadOnlyList<ProposalComment>>(async db =>
        {
            await VisibleAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            return await db.Comments.Where(c => c.ProposalId == proposalId).OrderBy(c => c.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
        }, cancellationToken);

    private static async Task<Proposal> VisibleAsync(CapReviewDbContext db, Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        Proposal? proposal = await db.Proposals.Include(p => p.Versions).SingleOrDefaultAsync(p => p.Id == proposalId, cancellationToken).ConfigureAwait(false);
        return proposal is not null && await ProposalAccess.CanSeeAsync(db, actor, proposal, cancellationToken).ConfigureAwait(false)
            ? proposal
            : throw new NotFoundException("There is no such proposal.");
    }
}
