namespace CapReview.Reviews.Proposals;

/// <summary>What a project lead enters for a proposal: its description and its assumptions, and why they changed.</summary>
public sealed record ProposalDraft(
    string Title,
    string Description,
    ProposalCategory Category,
    RiskClass RiskClass,
    ProposalAssumptions Assumptions,
    string? ChangeReason = null);
