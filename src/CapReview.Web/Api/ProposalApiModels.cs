using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;

namespace CapReview.Web.Api;

/// <summary>
/// A proposal as the API lists it, with a summary of each version: <c>versionUnderReview</c> is the last submitted one
/// (the one the board decides), <c>pendingRevision</c> the lead's revision waiting beside it while the board has the
/// proposal (null when there is none).
/// </summary>
public sealed record ProposalResponse(int Id, string Reference, string Title, string Description, ProposalCategory Category, RiskClass RiskClass,
    ProposalStatus Status, int? CycleId, int Revision, IReadOnlyList<VersionSummaryResponse> Versions, int? VersionUnderReview, int? PendingRevision)
{
    public static ProposalResponse From(ProposalView p)
    {
        ArgumentNullException.ThrowIfNull(p);
        return new(p.Id, p.Reference, p.Title, p.Description, p.Category, p.RiskClass, p.Status, p.BudgetCycleId, p.Revision,
            [.. p.Versions.Select(v => new VersionSummaryResponse(v.Number, v.CreatedAt, v.Reason, v.IsFrozen, v.FrozenAt, v.AssumptionsHash))],
            p.UnderReview?.Number, p.PendingRevision?.Number);
    }
}

/// <summary>One version without its assumptions.</summary>
public sealed record VersionSummaryResponse(int Number, DateTimeOffset CreatedAt, string Reason, bool Frozen, DateTimeOffset? FrozenAt, string AssumptionsHash);

/// <summary>
/// One version in full: its assumptions as stored (their SHA-256 is that of their canonical form), and its measures
/// at the board's MARR under the MARR policy named, or why there are none. Measures are estimates.
/// <c>assumptionsIntact</c> is false when the stored assumptions no longer give their SHA-256 (changed outside the app).
/// </summary>
public sealed record VersionResponse(int ProposalId, string Reference, int Number, DateTimeOffset CreatedAt, string Reason, bool Frozen, DateTimeOffset? FrozenAt,
    string AssumptionsHash, ProposalAssumptions Assumptions, int MarrPolicyVersion, EvaluationResponse? Evaluation, string? NotEvaluated, bool AssumptionsIntact);

/// <summary>A new draft as a lead sends it: the fields of the editor, the assumptions in the stored form.</summary>
public sealed record NewProposalRequest(string? Title, string? Description, ProposalCategory? Category, RiskClass? RiskClass, ProposalAssumptions? Assumptions);

/// <summary>A stored approval packet, without its bytes; <c>download</c> is its address.</summary>
public sealed record PacketResponse(int Id, string Kind, int CycleId, int? ProposalId, int? VersionNumber, string FileName, string Sha256, long Length,
    DateTimeOffset CreatedAt, bool DevelopmentCertificate, string Download)
{
    public static PacketResponse From(PacketSummary p)
    {
        ArgumentNullException.ThrowIfNull(p);
        return new(p.Id, p.Kind.ToString().ToLowerInvariant(), p.BudgetCycleId, p.ProposalId, p.VersionNumber, p.FileName, p.FileSha256, p.Length, p.CreatedAt,
            p.DevelopmentCertificate, $"/api/v1/packets/{p.Id}");
    }
}
