using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Portfolio;

/// <summary>One ranked proposal: the version ranked, its MARR, its measures on the cycle's basis, and its rules.</summary>
/// <param name="Proposal">The proposal.</param>
/// <param name="Version">The frozen version that was ranked.</param>
/// <param name="Marr">The MARR it is judged at: the policy's for its risk class, or its override (plus any what-if shift).</param>
/// <param name="Ranked">Its rank and measures.</param>
/// <param name="Group">The exclusive group it belongs to, if any.</param>
/// <param name="Prerequisites">References of the proposals it needs.</param>
public sealed record RankingRow(ProposalView Proposal, VersionView Version, AnnualRate Marr, RankedProposal Ranked, ExclusiveGroup? Group, IReadOnlyList<string> Prerequisites);

/// <summary>A proposal of the cycle that could not be ranked, and why.</summary>
public sealed record UnrankedProposal(ProposalView Proposal, string Reason);

/// <summary>
/// A cycle's proposals ranked by annual worth on the cycle's basis, with those that could not be ranked and the
/// cycle's rules; <c>MarrShift</c> is the effective annual points added to every MARR (0 for the cycle's own).
/// </summary>
public sealed record CycleRanking(BudgetCycle Cycle, MarrPolicyVersion Marr, double MarrShift, IReadOnlyList<RankingRow> Rows,
    IReadOnlyList<UnrankedProposal> Unranked, PortfolioRules Rules)
{
    /// <summary>Ranked on after-tax flows at the after-tax MARR.</summary>
    public bool AfterTax { get; init; }

    /// <summary>The basis of the ranking in words.</summary>
    public string Basis => (AfterTax ? "after-tax " : "") + (Cycle.StudyPeriodYears is int years
        ? $"annual worth over a study period of {years} years"
        : "annual worth over each proposal's own life (repeatability)");

    /// <summary>The annual MARR values at which two ranked proposals' annual worths over their lives are equal, between 0 % and 40 %.</summary>
    public IReadOnlyList<double> SwapRates(string first, string second)
    {
        RankingRow a = Rows.Single(r => r.Proposal.Reference == first), b = Rows.Single(r => r.Proposal.Reference == second);
        return MarrWhatIf.SwapRates(a.Ranked.Evaluation.Model, b.Ranked.Evaluation.Model, 0.0, 0.40);
    }

    /// <summary>
    /// Where two ranked proposals change places (<see cref="SwapRates"/>), against this ranking's what-if: their MARRs
    /// in it and which of them it ranks ahead, so the answer moves with the what-if as the ranking does.
    /// </summary>
    public SwapAnswer Swap(string first, string second)
    {
        RankingRow a = Rows.Single(r => r.Proposal.Reference == first), b = Rows.Single(r => r.Proposal.Reference == second);
        string ahead = a.Ranked.Rank <= b.Ranked.Rank ? first : second;
        return new SwapAnswer(first, second, SwapRates(first, second), MarrShift, a.Marr.EffectiveAnnual(), b.Marr.EffectiveAnnual(), ahead);
    }
}
