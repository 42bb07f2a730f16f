namespace CapReview.Reviews.Audit;

/// <summary>
/// The result of checking the audit chain: intact, or the first event (or anchor) that does not hold. Events written
/// before the chain was keyed are counted apart: their plain hashes prove less.
/// </summary>
public sealed record AuditVerification(bool Intact, int EventsChecked, long? FirstBrokenEventId, string Message,
    int UnkeyedEvents = 0, int AnchorsChecked = 0, AuditHead? Head = null);
