using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Web.Api;

/// <summary>The MARR policy a proposal is judged under: its cycle's, or the current one for a draft outside any cycle.</summary>
public static class BoardPolicy
{
    public static async Task<MarrPolicyVersion> ForAsync(ProposalView proposal, CycleService cycles, MarrPolicyService policies, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(cycles);
        ArgumentNullException.ThrowIfNull(policies);
        if (proposal.BudgetCycleId is int cycleId)
        {
            return (await cycles.GetAsync(cycleId, cancellationToken).ConfigureAwait(false)).Marr;
        }
        var versions = await policies.ListAsync(cancellationToken).ConfigureAwait(false);
        return versions.Count > 0 ? versions[^1] : throw new RuleViolationException("There is no MARR policy yet.");
    }
}
