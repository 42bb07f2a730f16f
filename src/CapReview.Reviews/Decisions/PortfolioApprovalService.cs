using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// "Approve the selected portfolio": the approvals of the funded selection (the optimal set at the cycle's own MARR,
/// limits and objective) that are not yet recorded, listed for the member to confirm, then recorded in one step.
/// Proposals outside the selection keep their decisions or stay to be decided one by one.
/// </summary>
public sealed class PortfolioApprovalService(PortfolioService portfolios, DecisionService decisions)
{
    /// <summary>The approvals the selected portfolio needs, in ranking order; empty when every one is recorded.</summary>
    public async Task<IReadOnlyList<PortfolioApproval>> PlanAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
        PortfolioResult result = await portfolios.SelectAsync(actor, cycleId, new PortfolioQuery(), cancellationToken).ConfigureAwait(false);
        if (result.Ranking.Cycle.Status is not (Cycles.CycleStatus.Open or Cycles.CycleStatus.InReview))
        {
            throw new RuleViolationException($"The cycle {result.Ranking.Cycle.Name} is already decided.");
        }
        if (!result.Optimal.Feasible)
        {
            throw new RuleViolationException("No set of the cycle's proposals meets its capital limits and rules, so there is no selected portfolio to approve: decide each proposal on its own.");
        }
        var chosen = result.Optimal.Chosen.ToHashSet(StringComparer.Ordinal);
        return [.. result.Ranking.Rows
            .Where(r => chosen.Contains(r.Proposal.Reference) && r.Proposal.Status != ProposalStatus.Approved)
            .Select(r => new PortfolioApproval(r.Proposal.Id, r.Proposal.Reference, r.Proposal.Title, r.Version.Number, r.Ranked.FirstCost))];
    }

    /// <summary>
    /// The board's rules that approving <paramref name="plan"/> would break, with the decisions already recorded (an
    /// approval outside the selection may leave too little of a limit, say); empty when it breaks none. Nothing is
    /// recorded: the member sees the rules named before confirming, and confirms with an override and its reason.
    /// </summary>
    public Task<IReadOnlyList<RuleStanding>> RulesBrokenAsync(Actor actor, int cycleId, IReadOnlyList<PortfolioApproval> plan, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(plan);
        return decisions.PreviewAllAsync(actor, cycleId, Requests(cycleId, plan), cancellationToken);
    }

    /// <summary>
    /// Records the approvals the member confirmed, all or none. The selection is computed again: if it no longer asks
    /// for exactly the confirmed approvals (a decision, a rule or a version changed meanwhile), nothing is recorded and
    /// the member looks again.
    /// </summary>
    public async Task<IReadOnlyList<Decision>> ApproveAsync(Actor actor, int cycleId, IReadOnlyCollection<int> confirmed, bool overrideRules, string? overrideReason,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(confirmed);
        var plan = await PlanAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        if (!plan.Select(p => p.ProposalId).ToHashSet().SetEquals(confirmed))
        {
            throw new ConcurrencyConflictException(plan.Count == 0
                ? "Every proposal of the selected portfolio is already approved: nothing was recorded."
                : $"The selected portfolio now asks to approve {string.Join(", ", plan.Select(p => p.Reference))}, not what was confirmed. Look at it again and confirm.");
        }
        if (plan.Count == 0)
        {
            throw new RuleViolationException("Every proposal of the selected portfolio is already approved.");
        }
        return await decisions.DecideAllAsync(actor, cycleId, Requests(cycleId, plan), overrideRules, overrideReason, cancellationToken).ConfigureAwait(false);
    }

    private static List<DecisionRequest> Requests(int cycleId, IReadOnlyList<PortfolioApproval> plan) =>
        [.. plan.Select(p => new DecisionRequest(p.ProposalId, DecisionOutcome.Approve, "", cycleId, p.Version, null))];
}
