namespace CapReview.Reviews.Audit;

/// <summary>
/// Where the audit chain stood at a moment: how many events it held and the last one's hash. Kept outside the
/// database's reach (on every signed packet, and in the operator's head log), it lets verification notice events
/// cut from the end or a chain rewritten from some point on.
/// </summary>
public sealed record AuditHead(long Count, string Hash)
{
    /// <summary>The head of an empty chain.</summary>
    public static AuditHead Empty { get; } = new(0, AuditChain.Genesis);

    /// <summary>One line of the head log: the count, a tab, the hash.</summary>
    public string ToLine() => $"{Count.ToString(System.Globalization.CultureInfo.InvariantCulture)}\t{Hash}";

    public static AuditHead? Parse(string line)
    {
        ArgumentNullException.ThrowIfNull(line);
        string[] parts = line.Split('\t', StringSplitOptions.TrimEntries);
        return parts.Length >= 2 && long.TryParse(parts[0], System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out long count)
            && parts[1].Length == 64 ? new AuditHead(count, parts[1]) : null;
    }
}
