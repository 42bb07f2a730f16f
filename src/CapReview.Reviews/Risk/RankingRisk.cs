using CapReview.Reviews.Portfolio;

namespace CapReview.Reviews.Risk;

/// <summary>
/// The ranking's risk column: each proposal's probability of a loss (present worth below zero) from its own risk
/// settings, trials and seed, at the ranking's MARR and basis. People start it through <see cref="RiskRuns"/>.
/// </summary>
public static class RankingRisk
{
    /// <summary>Each ranked proposal's risk study by reference; null for one without risk settings (or whose settings cannot be read).</summary>
    public static IReadOnlyDictionary<string, RiskStudy?> Studies(CycleRanking ranking, bool afterTax)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        var studies = new Dictionary<string, RiskStudy?>(StringComparer.Ordinal);
        foreach (var row in ranking.Rows)
        {
            studies[row.Proposal.Reference] = ProposalRisk.Prepare(row.Version.Assumptions, ranking.Marr, row.Proposal.RiskClass, afterTax)?.Value;
        }
        return studies;
    }

    /// <summary>
    /// The proposals whose simulation centres on a most likely value apart from the model's (a parameter set apart on
    /// purpose, or one the model moved away from), so the ranking can say so beside the probability of a loss.
    /// </summary>
    public static IReadOnlySet<string> ApartFromTheModel(IReadOnlyDictionary<string, RiskStudy?> studies)
    {
        ArgumentNullException.ThrowIfNull(studies);
        return studies.Where(s => s.Value is { Drifts.Count: > 0 }).Select(s => s.Key).ToHashSet(StringComparer.Ordinal);
    }

    /// <summary>
    /// P(PW &lt; 0) by proposal reference; null for a proposal without risk settings. Stops between proposals and
    /// between trials when <paramref name="cancellationToken"/> is cancelled.
    /// </summary>
    public static IReadOnlyDictionary<string, double?> LossProbabilities(CycleRanking ranking, bool afterTax, CancellationToken cancellationToken) =>
        LossProbabilities(Studies(ranking, afterTax), cancellationToken);

    /// <summary>P(PW &lt; 0) of studies already prepared (<see cref="Studies"/>).</summary>
    public static IReadOnlyDictionary<string, double?> LossProbabilities(IReadOnlyDictionary<string, RiskStudy?> studies, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(studies);
        var losses = new Dictionary<string, double?>(StringComparer.Ordinal);
        foreach (var (reference, study) in studies)
        {
            cancellationToken.ThrowIfCancellationRequested();
            losses[reference] = study is null ? null : ProposalRisk.Simulate(study, cancellationToken: cancellationToken).ProbabilityOfLoss;
        }
        return losses;
    }
}
