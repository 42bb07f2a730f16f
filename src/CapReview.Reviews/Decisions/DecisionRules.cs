using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// The board's own rules applied to its decisions: each proposal's status says whether it is approved, decided
/// otherwise, or still to be decided. A rule that a decision still to come could keep is open, not broken; a
/// mandatory group with none approved is broken only once every member is decided.
/// </summary>
internal static class DecisionRules
{
    public static DecisionStanding Of(BudgetCycle cycle, MarrPolicyVersion marr, IReadOnlyCollection<Proposal> proposals, PortfolioRules rules)
    {
        var approved = proposals.Where(p => p.Status == ProposalStatus.Approved).ToList();
        var byId = proposals.ToDictionary(p => p.Id);
        double[] limits = [(double)cycle.CapitalLimit, .. cycle.LaterYearLimits.Select(l => (double)l)];
        var capital = approved.Select(p => ProposalCapital.ByYear(p, marr)).ToList();
        var years = limits.Select((limit, year) => new BudgetYearStanding(year, capital.Sum(c => year < c.Count ? c[year] : 0.0), limit)).ToList();

        var standings = new List<RuleStanding>();
        foreach (ExclusiveGroup group in rules.Groups)
        {
            var members = group.ProposalIds.Where(byId.ContainsKey).Select(id => byId[id]).ToList();
            string names = string.Join(", ", members.Select(m => m.Reference));
            var chosen = members.Where(m => m.Status == ProposalStatus.Approved).Select(m => m.Reference).ToList();
            bool pending = members.Any(Pending);
            string detail = chosen.Count == 0 ? "none approved" : "approved: " + string.Join(", ", chosen);
            RuleState state = chosen.Count > 1 ? RuleState.Broken
                : !group.Mandatory || chosen.Count == 1 ? (chosen.Count == 0 && pending ? RuleState.Open : RuleState.Met)
                : pending ? RuleState.Open : RuleState.Broken;
            standings.Add(new RuleStanding($"group:{group.Name}",
                group.Mandatory ? $"Exactly one of {group.Name} ({names}) is approved" : $"At most one of {group.Name} ({names}) is approved",
                detail, state));
        }
        foreach (Contingency c in rules.Contingencies)
        {
            if (!byId.TryGetValue(c.DependentProposalId, out Proposal? dependent) || !byId.TryGetValue(c.PrerequisiteProposalId, out Proposal? prerequisite))
            {
                continue;
            }
            string rule = $"{dependent.Reference} is approved only with its prerequisite {prerequisite.Reference}";
            RuleState state = dependent.Status != ProposalStatus.Approved || prerequisite.Status == ProposalStatus.Approved ? RuleState.Met
                : Pending(prerequisite) ? RuleState.Open : RuleState.Broken;
            string detail = dependent.Status != ProposalStatus.Approved ? $"{dependent.Reference} is not approved"
                : $"{prerequisite.Reference} is {ProposalStatusWords.Describe(prerequisite.Status)}";
            standings.Add(new RuleStanding($"needs:{dependent.Id}:{prerequisite.Id}", rule, detail, state));
        }
        return new DecisionStanding(years, standings);
    }

    private static bool Pending(Proposal p) => p.Status is ProposalStatus.Submitted or ProposalStatus.InReview;
}
