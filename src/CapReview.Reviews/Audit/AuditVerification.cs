namespace CapReview.Reviews.Audit;

/// <summary>The result of checking the audit chain: intact, or the first event whose hash or link does not hold.</summary>
public sealed record AuditVerification(bool Intact, int EventsChecked, long? FirstBrokenEventId, string Message);
