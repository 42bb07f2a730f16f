namespace CapReview.Reviews.Audit;

/// <summary>
/// The operator's log of the audit chain's head (<c>Audit:HeadLog</c>): one line per <c>audit-head</c> run, ideally
/// kept where the database's writers cannot reach (another machine, write-once storage). Verification checks that
/// every head it holds is still in the chain. Without a path there is no log.
/// </summary>
public sealed class AuditHeadLog(string? path)
{
    public string? Path { get; } = path;

    /// <summary>The heads recorded so far; a line that is not a head is skipped.</summary>
    public IReadOnlyList<AuditHead> Read() =>
        Path is null || !File.Exists(Path) ? [] : [.. File.ReadLines(Path).Select(AuditHead.Parse).OfType<AuditHead>()];

    /// <summary>Adds the head to the log.</summary>
    public void Append(AuditHead head)
    {
        ArgumentNullException.ThrowIfNull(head);
        if (Path is null)
        {
            throw new InvalidOperationException("No head log is configured (Audit:HeadLog).");
        }
        File.AppendAllLines(Path, [head.ToLine()]);
    }
}
