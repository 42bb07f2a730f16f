namespace CapReview.Reviews.Audit;

/// <summary>
/// One audit event as a person reads it: who by name, and the item in words (a proposal's reference and title, a
/// cycle's name, a person's name) rather than ids. <see cref="ProposalReference"/> is set for events on a proposal.
/// </summary>
public sealed record AuditRow(long Id, DateTimeOffset At, string UserId, string Person, string Action, string Item, string? ProposalReference, string? Before, string? After, string Hash);
