using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;

namespace CapReview.Reviews.Portfolio;

/// <summary>The choice within one exclusive group: by annual worth and by the incremental analysis, or why it cannot be made.</summary>
/// <param name="Group">The group.</param>
/// <param name="Marr">The one MARR the alternatives are compared at.</param>
/// <param name="MarrNote">Why that MARR, in words.</param>
/// <param name="Decision">The choice and each incremental step; null with <paramref name="Refusal"/>.</param>
/// <param name="Refusal">Why the group cannot be analysed as it stands.</param>
public sealed record GroupAnalysis(ExclusiveGroup Group, AnnualRate? Marr, string MarrNote, ExclusiveDecision? Decision, string? Refusal);

/// <summary>
/// Analyses each exclusive group of a ranked cycle on the ranking's basis: over the cycle's study period when it has
/// one, else over the common multiple of the lives. Alternatives are compared at one MARR: when their risk classes or
/// overrides give them different MARRs, the highest, so that no alternative is favoured by a lower hurdle.
/// </summary>
public static class GroupAnalyses
{
    public static IReadOnlyList<GroupAnalysis> Of(CycleRanking ranking)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        var byId = ranking.Rows.ToDictionary(r => r.Proposal.Id);
        var analyses = new List<GroupAnalysis>();
        foreach (ExclusiveGroup group in ranking.Rules.Groups)
        {
            var members = group.ProposalIds.Where(byId.ContainsKey).Select(id => byId[id]).ToList();
            if (members.Count == 0)
            {
                analyses.Add(new(group, null, "", null, "None of its proposals is in the ranking."));
                continue;
            }
            RankingRow hurdle = members.MaxBy(m => m.Marr.EffectiveAnnual())!;
            AnnualRate marr = AnnualRate.Effective(hurdle.Marr.EffectiveAnnual());
            string note = members.Select(m => m.Marr.EffectiveAnnual()).Distinct().Count() == 1
                ? "the MARR of its proposals"
                : $"the highest MARR of its proposals ({hurdle.Proposal.Reference}'s), so that no alternative is favoured by a lower hurdle";
            try
            {
                // Over the cycle's study period when it has one, each on the flows and stated value the ranking uses.
                var decision = ExclusiveChoice.Decide(
                    [.. members.Select(m => new Alternative(m.Proposal.Reference, m.Ranked.Evaluation.Model, m.Version.Assumptions.ValueAtStudyEnd))],
                    marr, group.Mandatory, ranking.Cycle.StudyPeriodYears);
                analyses.Add(new(group, marr, note, decision, null));
            }
            catch (ArgumentException ex)
            {
                analyses.Add(new(group, marr, note, null, ex.Message.Split(" (Parameter", 2)[0]));
            }
        }
        return analyses;
    }
}
