using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// A cycle as a decision is recorded in it, read in the decision's own transaction: the cycle, its MARR, every proposal
/// (tracked, so that a decision made on one shows in the standing at once) and the board's portfolio rules.
/// </summary>
internal sealed class CycleDecisions
{
    private readonly Dictionary<int, (ProposalStatus Status, int? Decision)> _before = [];

    private CycleDecisions(BudgetCycle cycle, MarrPolicyVersion marr, IReadOnlyList<Proposal> proposals, PortfolioRules rules) =>
        (Cycle, Marr, Proposals, Rules) = (cycle, marr, proposals, rules);

    public BudgetCycle Cycle { get; }

    public MarrPolicyVersion Marr { get; }

    public IReadOnlyList<Proposal> Proposals { get; }

    public PortfolioRules Rules { get; }

    public static async Task<CycleDecisions> ForProposalAsync(CapReviewDbContext db, int proposalId, int? expectedCycle, CancellationToken cancellationToken)
    {
        var found = await db.Proposals.Where(p => p.Id == proposalId).Select(p => new { p.BudgetCycleId }).SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false)
            ?? throw new NotFoundException("There is no such proposal.");
        if (expectedCycle is int named && named != found.BudgetCycleId)
        {
            throw new NotFoundException("There is no such proposal in this cycle.");
        }
        return found.BudgetCycleId is int cycleId
            ? await ForCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false)
            : throw new RuleViolationException("Only a submitted proposal can be decided.");
    }

    public static async Task<CycleDecisions> ForCycleAsync(CapReviewDbContext db, int cycleId, CancellationToken cancellationToken)
    {
        BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
            ?? throw new NotFoundException("There is no such budget cycle.");
        MarrPolicyVersion marr = await db.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false);
        var proposals = await db.Proposals.Include(p => p.Versions).Where(p => p.BudgetCycleId == cycleId).OrderBy(p => p.Id)
            .ToListAsync(cancellationToken).ConfigureAwait(false);
        PortfolioRules rules = await PortfolioRulesService.LoadAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
        return new CycleDecisions(cycle, marr, proposals, rules);
    }

    public Proposal Proposal(int proposalId) =>
        Proposals.SingleOrDefault(p => p.Id == proposalId) ?? throw new NotFoundException("There is no such proposal in this cycle.");

    public DecisionStanding Standing() => DecisionRules.Of(Cycle, Marr, Proposals, Rules);

    /// <summary>Notes a proposal's status and latest decision before a new decision on it, for the audit trail.</summary>
    public void RememberBefore(Proposal proposal, int? latestDecision) => _before.TryAdd(proposal.Id, (proposal.Status, latestDecision));

    public (ProposalStatus Status, int? Supersedes) Before(Proposal proposal) => _before[proposal.Id];
}
