namespace CapReview.Web.Exports;

/// <summary>How a column's values are written: as text, or as numbers with the format a reader expects.</summary>
public enum ExportKind
{
    Text,
    Money,
    Percent,
    Number,
    Whole,
}

/// <summary>One column of an exported table.</summary>
public sealed record ExportColumn(string Header, ExportKind Kind);

/// <summary>
/// A table to hand to finance as CSV or XLSX: a title, notes (the basis, the MARR, the cautions) and typed columns.
/// Numbers stay numbers (never formatted text), so a spreadsheet can total them.
/// </summary>
public sealed record ExportTable(string Title, IReadOnlyList<string> Notes, IReadOnlyList<ExportColumn> Columns, IReadOnlyList<IReadOnlyList<object?>> Rows)
{
    /// <summary>A file name from the title: letters, digits and hyphens.</summary>
    public string FileStem => string.Concat(Title.Select(c => char.IsLetterOrDigit(c) ? char.ToLowerInvariant(c) : '-')).Trim('-').Replace("--", "-", StringComparison.Ordinal);
}
