namespace CapReview.Reviews.Portfolio;

/// <summary>A cycle's exclusive groups and contingencies, as the selection must respect them.</summary>
public sealed record PortfolioRules(IReadOnlyList<ExclusiveGroup> Groups, IReadOnlyList<Contingency> Contingencies)
{
    public ExclusiveGroup? GroupOf(int proposalId) => Groups.FirstOrDefault(g => g.ProposalIds.Contains(proposalId));

    public IEnumerable<int> PrerequisitesOf(int proposalId) =>
        Contingencies.Where(c => c.DependentProposalId == proposalId).Select(c => c.PrerequisiteProposalId);
}

/// <summary>An exclusive group as the board enters it.</summary>
public sealed record GroupDraft(string Name, bool Mandatory, IReadOnlyList<int> ProposalIds);

/// <summary>The board's settings of a cycle's plan: the study period, the later years' limits and the objective.</summary>
public sealed record CyclePlan(int? StudyPeriodYears, IReadOnlyList<decimal> LaterYearLimits, SelectionObjective Objective);
