namespace CapReview.Reviews.Marr;

/// <summary>
/// The record that a MARR policy version was entered by mistake: the version itself stays as written (it is write-once,
/// and cycles already pinned to it keep it), while this record, itself written once, stops any new cycle from choosing it.
/// </summary>
public sealed class MarrVersionRetirement
{
    private MarrVersionRetirement()
    {
    }

    public MarrVersionRetirement(int marrPolicyVersionId, string reason, string retiredBy, DateTimeOffset retiredAt)
    {
        MarrPolicyVersionId = marrPolicyVersionId;
        Reason = reason;
        RetiredBy = retiredBy;
        RetiredAt = retiredAt;
    }

    public int Id { get; private set; }

    public int MarrPolicyVersionId { get; private set; }

    public string Reason { get; private set; } = "";

    public string RetiredBy { get; private set; } = "";

    public DateTimeOffset RetiredAt { get; private set; }
}
