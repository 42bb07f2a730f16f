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
    /// Puts a ranked cycle's proposals on one fair basis for the objective: the members of an exclusive or mandatory
    /// group take the figures of the group's incremental analysis (<see cref="GroupAnalyses"/>) at the group's one
    /// MARR, so that the selection and that analysis agree for every group. With a study period T that analysis, like
    /// the ranking, values every alternative over T (cut there with its stated value); without one it compares unequal
    /// lives under repeatability: present worth of each renewed like for like over the least common multiple of the
    /// group's lives, or annual worth. Adding present worth over each proposal's own life would favour the alternative
    /// that serves fewer years. A proposal in no group keeps its ranked worth: over T, or over its own life, which is
    /// its chain's worth over that life.
    /// </summary>
    public static SelectionWorths Of(CycleRanking ranking, SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        bool annual = objective == SelectionObjective.AnnualWorth;
        int? study = ranking.Cycle.StudyPeriodYears;
        var worth = ranking.Rows.ToDictionary(r => r.Proposal.Reference, r => annual ? r.Ranked.AnnualWorth : r.Ranked.PresentWorth, StringComparer.Ordinal);
        var renewals = ranking.Rows.ToDictionary(r => r.Proposal.Reference, _ => 1.0, StringComparer.Ordinal);
        var models = ranking.Rows.ToDictionary(r => r.Proposal.Reference, r => r.Ranked.Evaluation.Model, StringComparer.Ordinal);
        var refused = new List<string>();
        foreach (GroupAnalysis analysis in GroupAnalyses.Of(ranking))
        {
            if (analysis.Decision is not { } decision)
            {
                if (analysis.Refusal is { Length: > 0 } reason && analysis.Marr is not null)
                {
                    string own = study is null ? "their worth over their own lives" : "their ranked worth over the study period";
                    refused.Add($"the proposals of {analysis.Group.Name} keep {own} ({char.ToLowerInvariant(reason[0])}{reason[1..].TrimEnd('.')})");
                }
                continue;
            }
            foreach (var (reference, value) in annual ? decision.AnnualWorths : decision.PresentWorths)
            {
                worth[reference] = value;
                var model = models[reference];
                renewals[reference] = annual || study is not null ? 1.0
                    : CommonHorizon.Renewals(analysis.Marr!.Value.EffectivePerPeriod(model.PeriodsPerYear), model.Horizon, decision.CommonHorizon);
            }
        }
        string tax = ranking.AfterTax ? "after-tax " : "";
        string basis = study is int years
            ? string.Create(CultureInfo.InvariantCulture,
                $"{tax}{(annual ? "annual worth" : "present worth")} over the cycle's study period of {years} years, for every proposal; the alternatives of a group at the group's MARR, as its incremental analysis compares them")
            : annual
                ? $"{tax}annual worth over each proposal's own life (repeatability); the alternatives of a group at the group's MARR, as its incremental analysis compares them"
                : $"{tax}present worth of each proposal renewed like for like: the alternatives of a group over the least common multiple of their lives at the group's MARR, as its incremental analysis compares them; a proposal in no group over its own life";
        return new(worth, refused.Count == 0 ? basis : $"{basis}; {string.Join("; ", refused)}", renewals);
    }
}
