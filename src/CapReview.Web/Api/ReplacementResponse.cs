using CapReview.Reviews.Proposals;

namespace CapReview.Web.Api;

/// <summary>Keep or replace for one version: the MARR and where it comes from, both service lives and the advice.</summary>
public sealed record ReplacementResponse(int ProposalId, string Reference, int Version, double Marr, string MarrSource, double ChallengerFirstCost,
    ServiceLifeResponse Defender, ServiceLifeResponse Challenger, int YearsToKeep, double NextYearCost, string Recommendation)
{
    public static ReplacementResponse From(ReplacementReview r)
    {
        ArgumentNullException.ThrowIfNull(r);
        return new(r.Proposal.Id, r.Proposal.Reference, r.Version.Number, r.Marr.EffectiveAnnual(), r.MarrSource, r.ChallengerFirstCost,
            ServiceLifeResponse.From(r.Advice.Defender), ServiceLifeResponse.From(r.Advice.Challenger), r.Advice.YearsToKeep, r.Advice.NextYearCost, r.Advice.Recommendation);
    }
}
