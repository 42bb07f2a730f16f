using CsvHelper;

namespace CapReview.Web.Exports;

/// <summary>
/// Writes an <see cref="ExportTable"/> as RFC 4180 CSV (UTF-8 with a byte-order mark, so spreadsheets read the
/// currency's characters): the title and notes as leading comment lines (#), then the header and one row per record,
/// numbers in invariant form. Text that a spreadsheet would run as a formula is escaped.
/// </summary>
public static class CsvExport
{
    private static readonly CsvWriterOptions Options = new()
    {
        CommentPrefix = '#',
        WriteByteOrderMark = true,
        Injection = CsvInjection.Escape,
    };

    public static byte[] Write(ExportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        using var stream = new MemoryStream();
        using (CsvWriter csv = CsvWriter.Create(stream, Options, true))
        {
            foreach (string line in table.Notes.Prepend(table.Title))
            {
                csv.WriteComment(" " + line);
            }
            csv.WriteHeader([.. table.Columns.Select(c => c.Header)]);
            foreach (var row in table.Rows)
            {
                for (int k = 0; k < table.Columns.Count; k++)
                {
                    switch (row[k])
                    {
                        case null:
                            csv.WriteField("");
                            break;
                        case double d:
                            csv.WriteField(d, "R");
                            break;
                        case int i:
                            csv.WriteField(i, "");
                            break;
                        case decimal m:
                            csv.WriteField(m, "");
                            break;
                        case var other:
                            csv.WriteField(other.ToString());
                            break;
                    }
                }
                csv.EndRecord();
            }
        }
        return stream.ToArray();
    }
}
