using System.Globalization;
using CapReview.Engine.Comparison;

namespace CapReview.Reviews.Portfolio;

/// <summary>The worth the selection maximises for each ranked proposal, by reference, and that basis in words.</summary>
/// <param name="Worth">Each proposal's worth on the selection's basis.</param>
/// <param name="Basis">The basis, in words a board member reads (shown on the portfolio page, in the API and the packet).</param>
/// <param name="Renewals">
/// For a present-worth basis, what one life's present worth is multiplied by to reach the basis (the renewals of a
/// group's chain; 1 for a proposal over its own life or the study period), for trials that draw one life's worth.
/// </param>
public sealed record SelectionWorths(IReadOnlyDictionary<string, double> Worth, string Basis, IReadOnlyDictionary<string, double> Renewals)
{
    /// <summary>
    /// Puts a ranked cycle's proposals on one fair basis for the objective. With a study period every proposal is
    /// already on the common horizon T (present or annual worth over T, as ranked). Without one the ranking compares
    /// unequal lives by annual worth under repeatability, so the members of an exclusive or mandatory group take the
    /// figures of the group's incremental analysis (<see cref="GroupAnalyses"/>): present worth of each renewed like
    /// for like over the least common multiple of the group's lives, or annual worth, at the group's one MARR. Adding
    /// present worth over each proposal's own life would favour the alternative that serves fewer years; a proposal in
    /// no group keeps its worth over its own life, which is its chain's worth over that life.
    /// </summary>
    public static SelectionWorths Of(CycleRanking ranking, SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        bool annual = objective == SelectionObjective.AnnualWorth;
        var worth = ranking.Rows.ToDictionary(r => r.Proposal.Reference, r => annual ? r.Ranked.AnnualWorth : r.Ranked.PresentWorth, StringComparer.Ordinal);
        var renewals = ranking.Rows.ToDictionary(r => r.Proposal.Reference, _ => 1.0, StringComparer.Ordinal);
        string tax = ranking.AfterTax ? "after-tax " : "";
        if (ranking.Cycle.StudyPeriodYears is int years)
        {
            return new(worth, string.Create(CultureInfo.InvariantCulture,
                $"{tax}{(annual ? "annual worth" : "present worth")} over the cycle's study period of {years} years, for every proposal"), renewals);
        }
        var models = ranking.Rows.ToDictionary(r => r.Proposal.Reference, r => r.Ranked.Evaluation.Model, StringComparer.Ordinal);
        var refused = new List<string>();
        foreach (GroupAnalysis analysis in GroupAnalyses.Of(ranking))
        {
            if (analysis.Decision is not { } decision)
            {
                if (analysis.Refusal is { Length: > 0 } reason && analysis.Marr is not null)
                {
                    refused.Add($"the proposals of {analysis.Group.Name} keep their worth over their own lives ({char.ToLowerInvariant(reason[0])}{reason[1..].TrimEnd('.')})");
                }
                continue;
            }
            foreach (var (reference, value) in annual ? decision.AnnualWorths : decision.PresentWorths)
            {
                worth[reference] = value;
                var model = models[reference];
                renewals[reference] = annual ? 1.0
                    : CommonHorizon.Renewals(analysis.Marr!.Value.EffectivePerPeriod(model.PeriodsPerYear), model.Horizon, decision.CommonHorizon);
            }
        }
        string basis = annual
            ? $"{tax}annual worth over each proposal's own life (repeatability); the alternatives of a group at the group's MARR, as its incremental analysis compares them"
            : $"{tax}present worth of each proposal renewed like for like: the alternatives of a group over the least common multiple of their lives at the group's MARR, as its incremental analysis compares them; a proposal in no group over its own life";
        return new(worth, refused.Count == 0 ? basis : $"{basis}; {string.Join("; ", refused)}", renewals);
    }
}
