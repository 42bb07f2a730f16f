using CapReview.Engine.Comparison;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Decisions;

/// <summary>
/// The capital a proposal needs in each budget year on its latest submitted version, as the ranking and the portfolio
/// count it: year 0 the first cost (period 0's net outlay), later years the capital elements' outlays.
/// </summary>
internal static class ProposalCapital
{
    /// <summary>Capital by budget year from year 0; empty when the proposal has no submitted version or its model cannot be read.</summary>
    public static IReadOnlyList<double> ByYear(Proposal proposal, MarrPolicyVersion marr)
    {
        VersionView? version = ProposalView.Of(proposal).Versions.LastOrDefault(v => v.IsFrozen);
        if (version is null)
        {
            return [];
        }
        var read = SpecificationReader.Read(ProposalTerms.Model(version.Assumptions, marr, proposal.RiskClass));
        if (!read.IsValid)
        {
            return [];
        }
        var model = read.Value!.Model;
        return [Math.Max(0.0, -model.NetFlows[0]), .. ProposalRanking.LaterCapital(model)];
    }
}
