using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Api;

/// <summary>
/// The incremental analysis of the exclusive group a version belongs to: the group, the one MARR it is compared at and
/// why, the choice by annual worth and step by step and the horizon compared over (<c>Basis</c>); or, with <c>Refusal</c>, why the group cannot be analysed.
/// </summary>
public sealed record IncrementalAnalysisResponse(int ProposalId, string Reference, int Version, string Group, bool Mandatory, double? Marr, string MarrNote,
    string? BestByAnnualWorth, string? BestByIncrementalAnalysis, int? CommonHorizon, IReadOnlyDictionary<string, double>? AnnualWorths,
    IReadOnlyDictionary<string, double>? PresentWorths, IReadOnlyList<IncrementalStepResponse> Steps, string? Refusal, string? Basis)
{
    public static IncrementalAnalysisResponse From(VersionIncrementalAnalysis v)
    {
        ArgumentNullException.ThrowIfNull(v);
        var a = v.Analysis;
        var d = a.Decision;
        return new(v.Proposal.Id, v.Proposal.Reference, v.Version, a.Group.Name, a.Group.Mandatory, a.Marr?.EffectiveAnnual(), a.MarrNote,
            d?.BestByAnnualWorth, d?.BestByIncrementalAnalysis, d?.CommonHorizon, d?.AnnualWorths, d?.PresentWorths,
            [.. (d?.Steps ?? []).Select(IncrementalStepResponse.From)], a.Refusal, d?.Basis);
    }
}
