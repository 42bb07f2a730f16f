using CapReview.Reviews.Comments;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;

namespace CapReview.Web.Api;

/// <summary>A new version after a frozen one: the assumptions, why they changed, and the proposal's revision the lead started from.</summary>
public sealed record RevisionRequest(int? Revision, string? Reason, ProposalAssumptions? Assumptions);

/// <summary>A draft version's new assumptions and the proposal's revision the lead started from.</summary>
public sealed record DraftEditRequest(int? Revision, ProposalAssumptions? Assumptions);

/// <summary>A submission of the latest version to a cycle.</summary>
public sealed record SubmissionRequest(int? CycleId, int? Revision);

/// <summary>A withdrawal of the lead's proposal.</summary>
public sealed record WithdrawalRequest(int? Revision);

/// <summary>
/// A board member's decision on the version they judged; <c>revision</c> is optional. A decision that breaks the
/// board's portfolio rules needs <c>override</c> true and <c>overrideReason</c>.
/// </summary>
public sealed record DecisionApiRequest(int? ProposalId, DecisionOutcome? Outcome, string? Conditions, int? Version, int? Revision, bool? Override = null, string? OverrideReason = null);

/// <summary>The approvals of the selected portfolio a member confirms, by proposal id, with an override if the set breaks a rule.</summary>
public sealed record PortfolioApprovalRequest(IReadOnlyList<int>? ProposalIds, bool? Override = null, string? OverrideReason = null);

/// <summary>One approval the selected portfolio needs: the proposal, the version it would be approved on, and its first cost.</summary>
public sealed record PortfolioApprovalResponse(int ProposalId, string Reference, string Title, int Version, double FirstCost)
{
    public static PortfolioApprovalResponse From(PortfolioApproval a)
    {
        ArgumentNullException.ThrowIfNull(a);
        return new(a.ProposalId, a.Reference, a.Title, a.Version, a.FirstCost);
    }
}

/// <summary>
/// A recorded decision; <c>overriddenRules</c> and <c>overrideReason</c> are empty unless it was recorded against the
/// board's rules; <c>supersededBy</c> names the later decision on the same proposal that replaced it, if any.
/// </summary>
public sealed record DecisionResponse(int Id, int ProposalId, string Reference, int CycleId, int Version, string AssumptionsHash, int MarrPolicyVersionId,
    DecisionOutcome Outcome, string Conditions, string DecidedBy, DateTimeOffset DecidedAt, bool Imported, string OverriddenRules, string OverrideReason, int? SupersededBy)
{
    public static DecisionResponse From(DecisionView d)
    {
        ArgumentNullException.ThrowIfNull(d);
        return new(d.Id, d.ProposalId, d.Reference, d.CycleId, d.VersionNumber, d.AssumptionsHash, d.MarrPolicyVersionId, d.Outcome, d.Conditions, d.DecidedBy, d.DecidedAt, d.Imported,
            d.OverriddenRules, d.OverrideReason, d.SupersededBy);
    }
}

/// <summary>
/// A sign-off and the decisions it covered; <c>status</c> says what it counts for: <c>current</c> (it signed the
/// decisions as they stand), <c>superseded</c> (a later submission or decision changed them) or <c>imported</c>
/// (copied from another installation's document; never counts here).
/// </summary>
public sealed record SignOffResponse(int Id, int CycleId, string UserId, string Name, DateTimeOffset SignedAt, string Status, IReadOnlyList<SignedDecisionResponse> DecisionsSigned)
{
    public static SignOffResponse From(SignOff s, string status)
    {
        ArgumentNullException.ThrowIfNull(s);
        // Stored as the sign-off wrote it (the outcome's enum name); answered in the API's conventions.
        return new(s.Id, s.BudgetCycleId, s.UserId, s.DisplayName, s.SignedAt, status,
            [.. SignedDecision.Parse(s.DecisionsSigned).Select(d => new SignedDecisionResponse(d.Proposal, d.Version, d.AssumptionsHash,
                System.Text.Json.JsonNamingPolicy.CamelCase.ConvertName(d.Outcome)))]);
    }

    /// <summary>Every sign-off of the cycle in the order given, each with its status.</summary>
    public static IReadOnlyList<SignOffResponse> All(CycleSignOffs signOffs)
    {
        ArgumentNullException.ThrowIfNull(signOffs);
        return [.. signOffs.Current.Select(s => From(s, "current"))
            .Concat(signOffs.Superseded.Select(s => From(s, "superseded")))
            .Concat(signOffs.Imported.Select(s => From(s, "imported")))
            .OrderBy(s => s.Id)];
    }
}

/// <summary>One decision a sign-off covered: the proposal's reference, the version, its assumptions hash and the outcome.</summary>
public sealed record SignedDecisionResponse(string Proposal, int Version, string AssumptionsHash, string Outcome);

/// <summary>Where the making of a cycle's packets stands.</summary>
public sealed record PacketJobResponse(int CycleId, string Status, int Attempts, string RequestedBy, DateTimeOffset RequestedAt, DateTimeOffset UpdatedAt,
    DateTimeOffset? CompletedAt, DateTimeOffset? NextAttemptAt, string? LastError, int PacketsStored)
{
    public static PacketJobResponse From(PacketJobView j)
    {
        ArgumentNullException.ThrowIfNull(j);
        return new(j.CycleId, j.Status.ToString().ToLowerInvariant(), j.Attempts, j.RequestedByName, j.RequestedAt, j.UpdatedAt, j.CompletedAt, j.NextAttemptAt,
            j.LastError, j.PacketsStored);
    }
}

/// <summary>A comment to add.</summary>
public sealed record CommentRequest(string? Text);

/// <summary>A comment on a proposal, with the version that was current when it was written.</summary>
public sealed record CommentResponse(int Id, int ProposalId, int Version, string Author, DateTimeOffset At, string Text)
{
    public static CommentResponse From(ProposalComment c)
    {
        ArgumentNullException.ThrowIfNull(c);
        return new(c.Id, c.ProposalId, c.VersionNumber, c.AuthorName, c.At, c.Text);
    }
}
