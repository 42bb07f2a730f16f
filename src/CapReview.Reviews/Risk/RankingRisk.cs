using CapReview.Reviews.Portfolio;

namespace CapReview.Reviews.Risk;

/// <summary>
/// The ranking's risk column: each proposal's probability of a loss (present worth below zero) from its own risk
/// settings, trials and seed, at the ranking's MARR and basis.
/// </summary>
public static class RankingRisk
{
    /// <summary>
    /// P(PW &lt; 0) by proposal reference; null for a proposal without risk settings. Stops between proposals and
    /// between trials when <paramref name="cancellationToken"/> is cancelled.
    /// </summary>
    public static IReadOnlyDictionary<string, double?> LossProbabilities(CycleRanking ranking, bool afterTax, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        var losses = new Dictionary<string, double?>(StringComparer.Ordinal);
        foreach (var row in ranking.Rows)
        {
            cancellationToken.ThrowIfCancellationRequested();
            losses[row.Proposal.Reference] = ProposalRisk.Prepare(row.Version.Assumptions, ranking.Marr, row.Proposal.RiskClass, afterTax) is { Value: { } study }
                ? ProposalRisk.Simulate(study, cancellationToken: cancellationToken).ProbabilityOfLoss
                : null;
        }
        return losses;
    }
}
