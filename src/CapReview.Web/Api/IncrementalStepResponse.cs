using CapReview.Engine.Comparison;
using CapReview.Engine.Measures;

namespace CapReview.Web.Api;

/// <summary>One step of an incremental analysis: the current best against the next dearer alternative, and the outcome.</summary>
public sealed record IncrementalStepResponse(string Defender, string Challenger, double ExtraFirstCost, double IncrementalPresentWorth,
    double? IncrementalRateOfReturn, RateOfReturnKind IncrementalRateOfReturnKind, double? IncrementalBenefitCostRatio, bool ChallengerWins, string Reason)
{
    public static IncrementalStepResponse From(IncrementalStep s)
    {
        ArgumentNullException.ThrowIfNull(s);
        return new(s.Defender, s.Challenger, s.ExtraFirstCost, s.IncrementalPresentWorth, s.IncrementalRateOfReturn,
            s.IncrementalRootKind, s.IncrementalBenefitCost, s.ChallengerWins, s.Reason);
    }
}
