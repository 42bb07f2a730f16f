namespace CapReview.Web.Importing;

/// <summary>
/// One cell as read: its text, and its number when the file stored one (a spreadsheet's numeric cell), so that a
/// stored number is never re-read through a culture's separators.
/// </summary>
public readonly record struct SheetCell(string Text, double? Number)
{
    public bool IsBlank => Number is null && string.IsNullOrWhiteSpace(Text);
}

/// <summary>One row of a sheet: its number as the user sees it (the line of a CSV file, the row of a worksheet) and its cells.</summary>
public sealed record SheetRow(int Number, IReadOnlyList<SheetCell> Cells)
{
    public SheetCell this[int column] => column < Cells.Count ? Cells[column] : new SheetCell("", null);

    public bool IsBlank => Cells.All(c => c.IsBlank);
}

/// <summary>The rows of a CSV file or of one worksheet, before any meaning is given to them.</summary>
public sealed record SheetGrid(IReadOnlyList<SheetRow> Rows)
{
    /// <summary>The field separator of a CSV file (detected by CsvHelper); null for a worksheet.</summary>
    public char? Separator { get; init; }

    /// <summary>A column's letters as a spreadsheet shows them: 0 is A, 26 is AA.</summary>
    public static string ColumnLetters(int column)
    {
        string letters = "";
        for (int k = column + 1; k > 0; k = (k - 1) / 26)
        {
            letters = (char)('A' + ((k - 1) % 26)) + letters;
        }
        return letters;
    }
}

/// <summary>A file that could not be read as a sheet at all: too large, not CSV or XLSX, or malformed.</summary>
public sealed class UnreadableSheetException(string message) : Exception(message);
