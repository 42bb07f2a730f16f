namespace CapReview.Reviews.Audit;

/// <summary>The events a filter found, newest first, and whether more matched than were asked for.</summary>
public sealed record AuditSearchResult(IReadOnlyList<AuditRow> Rows, bool More);
