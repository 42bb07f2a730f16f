using CsvHelper;

namespace CapReview.Web.Exports;

/// <summary>
/// Writes an <see cref="ExportTable"/> as RFC 4180 CSV (UTF-8 with a byte-order mark, so spreadsheets read the
/// currency's characters): a plain table, the header on the first line and one row per record, numbers in invariant
/// form, so that a spreadsheet opens it as a table (no title or note lines above the header: decision 010, the notes
/// are their own table, <see cref="WriteNotes"/>, and the workbook's Notes sheet). Every text goes through the same
/// field writer, headers included (they carry names people typed: cycles, proposals, elements): quoted where it holds a
/// comma, a quote or a line break, and escaped with a leading apostrophe where a spreadsheet would run it as a formula
/// (= + - @, tab or CR first).
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

    /// <summary>The notes and cautions of <paramref name="tables"/> as a table of their own: one row per note, beside the title of its table.</summary>
    public static byte[] WriteNotes(params IReadOnlyList<ExportTable> tables) => Write(ExportNotes.Of(tables));
}
