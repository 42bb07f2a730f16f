using CsvHelper;

namespace CapReview.Web.Importing;

/// <summary>
/// Reads a CSV file with CsvHelper: the separator detected (comma, semicolon, tab or bar, so a file saved by a
/// spreadsheet in a comma-decimal culture reads too, and the separator found kept for the preview), lines starting with # skipped (the notes of exports from earlier
/// versions, and comments people add), each row numbered by its line in the file. Our exports' title and notes are now
/// ordinary rows above the header, which the import passes over while it looks for the header.
/// </summary>
public static class CsvSheetReader
{
    public static SheetGrid Read(byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        var options = new CsvReaderOptions
        {
            HasHeader = false,
            CommentPrefix = '#',
            SkipEmptyLines = true,
            TrackLineNumbers = true,
            MalformedData = CsvMalformedDataHandling.Throw,
        };
        var rows = new List<SheetRow>();
        char separator;
        try
        {
            using CsvReader reader = CsvReader.Create(bytes, options);
            separator = reader.Separator;
            while (reader.Read())
            {
                if (rows.Count == ImportLimits.MaxRows)
                {
                    throw new UnreadableSheetException($"The file has more than {ImportLimits.MaxRows:N0} rows; a model needs far fewer.");
                }
                if (reader.FieldCount > ImportLimits.MaxColumns)
                {
                    throw new UnreadableSheetException($"Line {reader.LineNumber} has {reader.FieldCount} columns; at most {ImportLimits.MaxColumns} are read.");
                }
                var cells = new SheetCell[reader.FieldCount];
                for (int k = 0; k < cells.Length; k++)
                {
                    cells[k] = new SheetCell(reader.GetString(k), null);
                }
                rows.Add(new SheetRow((int)reader.LineNumber, cells));
            }
        }
        catch (CsvFormatException ex)
        {
            throw new UnreadableSheetException($"This is not a readable CSV file: {ex.Message}");
        }
        return new SheetGrid(rows) { Separator = separator };
    }
}
