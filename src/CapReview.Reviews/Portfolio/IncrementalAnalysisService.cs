using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// The incremental analysis that applies to one version of a proposal: that of the exclusive group it belongs to in
/// its cycle, as the ranking compares the group (each member on its ranked version, at the group's one MARR). For the
/// board, finance and administrators, as the ranking is.
/// </summary>
public sealed class IncrementalAnalysisService(ProposalService proposals, CycleRankingService rankings)
{
    public async Task<VersionIncrementalAnalysis> ForVersionAsync(Actor actor, int proposalId, int versionNumber, CancellationToken cancellationToken)
    {
        ProposalView proposal = await proposals.GetAsync(actor, proposalId, cancellationToken).ConfigureAwait(false);
        proposal.Version(versionNumber);
        int cycleId = proposal.BudgetCycleId
            ?? throw new NotFoundException($"{proposal.Reference} is in no cycle, so in no exclusive group: there is no incremental analysis.");
        CycleRanking ranking = CycleRankingService.Rank(await rankings.LoadAsync(actor, cycleId, cancellationToken).ConfigureAwait(false), 0.0, afterTax: false);
        ExclusiveGroup group = ranking.Rules.GroupOf(proposalId)
            ?? throw new NotFoundException($"{proposal.Reference} is in no exclusive group: there is no incremental analysis.");
        RankingRow row = ranking.Rows.SingleOrDefault(r => r.Proposal.Id == proposalId)
            ?? throw new RuleViolationException($"version: {proposal.Reference} is not in its cycle's ranking, so its group's analysis leaves it out.");
        if (row.Version.Number != versionNumber)
        {
            throw new RuleViolationException($"version: the cycle ranks version {row.Version.Number} of {proposal.Reference}; its group's analysis is of that version.");
        }
        GroupAnalysis analysis = GroupAnalyses.Of(ranking).Single(a => a.Group.Id == group.Id);
        return new VersionIncrementalAnalysis(proposal, versionNumber, analysis);
    }
}
