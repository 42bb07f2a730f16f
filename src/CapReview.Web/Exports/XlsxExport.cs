using System.Globalization;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace CapReview.Web.Exports;

/// <summary>
/// Writes <see cref="ExportTable"/>s as worksheets with the Open XML SDK, each a plain table named by its title: the
/// bold header on the first row, then the rows with numbers stored as numbers under a money, percent or number format.
/// The tables' notes and cautions follow on a last sheet, Notes, one row per note beside its table's title.
/// </summary>
public static class XlsxExport
{
    // Cell format indexes in the stylesheet below.
    private const uint Plain = 0, Bold = 1, Money = 2, Percent = 3, Number = 4, Whole = 5;

    public static byte[] Write(ExportTable table) => Write([table]);

    /// <summary>A workbook with one worksheet per table, in order, each named by its title, then the Notes sheet when any table has notes.</summary>
    public static byte[] Write(IReadOnlyList<ExportTable> tables)
    {
        ArgumentNullException.ThrowIfNull(tables);
        if (tables.Any(t => t.Notes.Count > 0))
        {
            tables = [.. tables, ExportNotes.Of(tables)];
        }
        using var stream = new MemoryStream();
        using (var document = SpreadsheetDocument.Create(stream, SpreadsheetDocumentType.Workbook))
        {
            WorkbookPart workbook = document.AddWorkbookPart();
            workbook.Workbook = new Workbook();
            workbook.AddNewPart<WorkbookStylesPart>().Stylesheet = Styles();
            var sheets = workbook.Workbook.AppendChild(new Sheets());
            uint sheetId = 0;
            foreach (ExportTable table in tables)
            {
                WorksheetPart sheet = workbook.AddNewPart<WorksheetPart>();
                sheet.Worksheet = Worksheet(table);
                sheets.AppendChild(new Sheet
                {
                    Id = workbook.GetIdOfPart(sheet),
                    SheetId = ++sheetId,
                    Name = table.Title.Length > 31 ? table.Title[..31] : table.Title,
                });
            }
        }
        return stream.ToArray();
    }

    private static Worksheet Worksheet(ExportTable table)
    {
        var data = new SheetData();
        uint rowIndex = 0;
        Row NewRow() => data.AppendChild(new Row { RowIndex = ++rowIndex });

        NewRow().Append(table.Columns.Select(c => Text(c.Header, Bold)));
        foreach (var values in table.Rows)
        {
            NewRow().Append(table.Columns.Select((column, k) => Cell(values[k], column.Kind)));
        }
        var columns = new Columns(table.Columns.Select((c, k) => new Column
        {
            Min = (uint)k + 1,
            Max = (uint)k + 1,
            Width = c.Kind == ExportKind.Text ? 28 : 16,
            CustomWidth = true,
        }));
        return new Worksheet(columns, data);
    }

    private static Cell Cell(object? value, ExportKind kind) => value switch
    {
        null => new Cell(),
        double d when !double.IsFinite(d) => new Cell(),
        double d => NumberCell(d, kind),
        int i => NumberCell(i, kind),
        decimal m => NumberCell((double)m, kind),
        _ => Text(value.ToString() ?? "", Plain),
    };

    private static Cell NumberCell(double value, ExportKind kind) => new()
    {
        DataType = CellValues.Number,
        CellValue = new CellValue(value.ToString("R", CultureInfo.InvariantCulture)),
        StyleIndex = kind switch
        {
            ExportKind.Money => Money,
            ExportKind.Percent => Percent,
            ExportKind.Whole => Whole,
            _ => Number,
        },
    };

    private static Cell Text(string text, uint style) => new()
    {
        DataType = CellValues.InlineString,
        InlineString = new InlineString(new Text(text) { Space = SpaceProcessingModeValues.Preserve }),
        StyleIndex = style,
    };

    private static Stylesheet Styles() => new(
        new Fonts(new Font(), new Font(new Bold())) { Count = 2 },
        new Fills(new Fill(new PatternFill { PatternType = PatternValues.None }), new Fill(new PatternFill { PatternType = PatternValues.Gray125 })) { Count = 2 },
        new Borders(new Border()) { Count = 1 },
        new CellFormats(
            new CellFormat(),
            new CellFormat { FontId = 1, ApplyFont = true },
            // Built-in number formats: 4 is #,##0.00, 10 is 0.00%, 2 is 0.00, 3 is #,##0.
            new CellFormat { NumberFormatId = 4, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 10, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 2, ApplyNumberFormat = true },
            new CellFormat { NumberFormatId = 3, ApplyNumberFormat = true }) { Count = 6 });
}
