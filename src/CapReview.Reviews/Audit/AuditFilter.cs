namespace CapReview.Reviews.Audit;

/// <summary>
/// Which events of the audit trail to show: those on one proposal (by its reference), those one person did (by their
/// user id), between two days (UTC, both included). Every part is optional.
/// </summary>
public sealed record AuditFilter(string? ProposalReference = null, string? UserId = null, DateOnly? From = null, DateOnly? To = null);
