using System.Globalization;
using CapReview.Reviews.Audit;
using CsvHelper;

namespace CapReview.Web.Exports;

/// <summary>
/// The filtered audit trail as a plain CSV table: one header line, then one line per event, nothing before them, so a
/// spreadsheet opens it as a table. Times in UTC (ISO 8601); texts people typed are escaped where a spreadsheet would run
/// them as a formula, as in <see cref="CsvExport"/>.
/// </summary>
public static class AuditCsv
{
    private static readonly CsvWriterOptions Options = new()
    {
        CommentPrefix = '#',
        WriteByteOrderMark = true,
        Injection = CsvInjection.Escape,
    };

    public static readonly string[] Headers = ["Event", "When (UTC)", "Who", "What", "Item", "Proposal", "Before", "After", "Hash", "Action"];

    public static byte[] Write(IEnumerable<AuditRow> rows)
    {
        ArgumentNullException.ThrowIfNull(rows);
        using var stream = new MemoryStream();
        using (CsvWriter csv = CsvWriter.Create(stream, Options, true))
        {
            foreach (string header in Headers)
            {
                csv.WriteField(header);
            }
            csv.EndRecord();
            foreach (AuditRow row in rows)
            {
                csv.WriteField(row.Id.ToString(CultureInfo.InvariantCulture));
                csv.WriteField(row.At.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss", CultureInfo.InvariantCulture));
                csv.WriteField(row.Person);
                csv.WriteField(AuditWording.Of(row.Action));
                csv.WriteField(row.Item);
                csv.WriteField(row.ProposalReference ?? "");
                csv.WriteField(row.Before ?? "");
                csv.WriteField(row.After ?? "");
                csv.WriteField(row.Hash);
                csv.WriteField(row.Action);
                csv.EndRecord();
            }
        }
        return stream.ToArray();
    }

    /// <summary>The file's name: the trail, and the filter's days when it has them.</summary>
    public static string FileName(AuditFilter filter)
    {
        ArgumentNullException.ThrowIfNull(filter);
        string days = (filter.From, filter.To) switch
        {
            (DateOnly from, DateOnly to) => $"-{from:yyyy-MM-dd}-to-{to:yyyy-MM-dd}",
            (DateOnly from, null) => $"-from-{from:yyyy-MM-dd}",
            (null, DateOnly to) => $"-to-{to:yyyy-MM-dd}",
            _ => "",
        };
        return $"audit-trail{days}.csv";
    }
}
