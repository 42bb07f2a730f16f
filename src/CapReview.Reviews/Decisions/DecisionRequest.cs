namespace CapReview.Reviews.Decisions;

/// <summary>
/// A board member's decision as asked for: the proposal, the outcome and its conditions, and optionally what the member
/// saw (the cycle, the version judged, the proposal's revision) so that a decision is never recorded on anything else.
/// A decision that breaks the board's portfolio rules is recorded only with <paramref name="Override"/> and a reason.
/// </summary>
public sealed record DecisionRequest(int ProposalId, DecisionOutcome Outcome, string? Conditions, int? CycleId, int? Version, int? ExpectedRevision,
    bool Override = false, string? OverrideReason = null);
