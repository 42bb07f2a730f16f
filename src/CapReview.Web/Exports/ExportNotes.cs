namespace CapReview.Web.Exports;

/// <summary>
/// The notes of exported tables (the basis, the MARR, the cautions) as a table of their own, so that the tables stay
/// plain: the CSV "notes" download and the workbook's Notes sheet.
/// </summary>
public static class ExportNotes
{
    public const string SheetName = "Notes";

    public static ExportTable Of(IReadOnlyList<ExportTable> tables)
    {
        ArgumentNullException.ThrowIfNull(tables);
        return new ExportTable(SheetName, [], [new("Table", ExportKind.Text), new("Note", ExportKind.Text)],
            [.. tables.SelectMany(t => t.Notes.Select(note => (IReadOnlyList<object?>)[t.Title, note]))]);
    }
}
