using CsvHelper;

namespace CapReview.Web.Exports;

/// <summary>
/// Writes an <see cref="ExportTable"/> as RFC 4180 CSV (UTF-8 with a byte-order mark, so spreadsheets read the
/// currency's characters): the title and each note on a line of its own in the first column, then the header and one
/// row per record, numbers in invariant form. Every line is as wide as the table and every text goes through the same
/// field writer, the title, notes and headers included (they carry names people typed: cycles, proposals, elements):
/// quoted where it holds a comma, a quote or a line break, and escaped with a leading apostrophe where a spreadsheet
/// would run it as a formula (= + - @, tab or CR first). Comment lines would be written as typed, with neither.
/// </summary>
public static class CsvExport
{
    private static readonly CsvWriterOptions Options = new()
    {
        // No comments are written; the prefix makes the writer quote a first field that starts with '#', so that a
        // reader skipping '#' lines (ours, for files from older versions) still reads it.
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
                csv.WriteField(line);
                for (int k = 1; k < table.Columns.Count; k++)
                {
                    csv.WriteField("");
                }
                csv.EndRecord();
            }
            foreach (ExportColumn column in table.Columns)
            {
                csv.WriteField(column.Header);
            }
            csv.EndRecord();
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
