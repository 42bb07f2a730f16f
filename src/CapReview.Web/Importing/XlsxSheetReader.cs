using System.Globalization;
using System.IO.Packaging;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;

namespace CapReview.Web.Importing;

/// <summary>
/// Reads one worksheet of an XLSX workbook with the Open XML SDK: the sheet named <c>Elements</c> or
/// <c>Cash flows</c> when there is one (the sheets our version export writes), else the first. Numeric cells keep
/// their stored number; text comes from the shared-string table or the cell itself; a formula gives its saved result.
/// </summary>
public static class XlsxSheetReader
{
    /// <summary>The sheet names that hold an importable table, in the order they are looked for.</summary>
    public static readonly IReadOnlyList<string> PreferredSheets = ["Elements", "Cash flows"];

    public static SheetGrid Read(byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        try
        {
            using var document = SpreadsheetDocument.Open(new MemoryStream(bytes, writable: false), false,
                new OpenSettings { MaxCharactersInPart = ImportLimits.MaxCharactersInPart });
            WorkbookPart workbook = document.WorkbookPart ?? throw new UnreadableSheetException("The workbook has no sheets.");
            var sheets = workbook.Workbook.Descendants<Sheet>().ToList();
            Sheet sheet = PreferredSheets.Select(name => sheets.FirstOrDefault(s => string.Equals(s.Name?.Value, name, StringComparison.OrdinalIgnoreCase)))
                .FirstOrDefault(s => s is not null) ?? sheets.FirstOrDefault() ?? throw new UnreadableSheetException("The workbook has no sheets.");
            string id = sheet.Id?.Value ?? throw new UnreadableSheetException($"The workbook's list of sheets is damaged: “{sheet.Name}” names no part.");
            if (workbook.GetPartById(id) is not WorksheetPart part)
            {
                throw new UnreadableSheetException($"“{sheet.Name}” is a chart sheet, not a table.");
            }
            var shared = workbook.SharedStringTablePart?.SharedStringTable.Elements<SharedStringItem>().Select(i => i.InnerText).ToList() ?? [];
            return new SheetGrid(ReadRows(part, shared));
        }
        catch (Exception ex) when (ex is OpenXmlPackageException or FileFormatException or InvalidDataException or InvalidOperationException or ArgumentException
            or System.Xml.XmlException or IOException or FormatException or OverflowException)
        {
            throw new UnreadableSheetException("This is not a readable XLSX workbook.");
        }
    }

    private static List<SheetRow> ReadRows(WorksheetPart part, IReadOnlyList<string> shared)
    {
        var rows = new List<SheetRow>();
        foreach (Row row in part.Worksheet.Descendants<Row>())
        {
            if (rows.Count == ImportLimits.MaxRows)
            {
                throw new UnreadableSheetException($"The sheet has more than {ImportLimits.MaxRows:N0} rows; a model needs far fewer.");
            }
            int number = (int)(row.RowIndex?.Value ?? (uint)(rows.Count == 0 ? 1 : rows[^1].Number + 1));
            var cells = new List<SheetCell>();
            foreach (Cell cell in row.Elements<Cell>())
            {
                int column = cell.CellReference?.Value is string reference ? ColumnIndex(reference) : cells.Count;
                if (column >= ImportLimits.MaxColumns)
                {
                    throw new UnreadableSheetException($"Row {number} has more than {ImportLimits.MaxColumns} columns.");
                }
                while (cells.Count < column)
                {
                    cells.Add(new SheetCell("", null));
                }
                cells.Add(Value(cell, shared));
            }
            rows.Add(new SheetRow(number, cells));
        }
        return rows;
    }

    private static SheetCell Value(Cell cell, IReadOnlyList<string> shared)
    {
        string raw = cell.CellValue?.Text ?? "";
        CellValues? type = cell.DataType?.Value;
        if (type == CellValues.SharedString)
        {
            return new SheetCell(int.TryParse(raw, NumberStyles.None, CultureInfo.InvariantCulture, out int k) && k < shared.Count ? shared[k] : "", null);
        }
        if (type == CellValues.InlineString)
        {
            return new SheetCell(cell.InlineString?.InnerText ?? "", null);
        }
        if (type is null || type == CellValues.Number)
        {
            return double.TryParse(raw, NumberStyles.Float, CultureInfo.InvariantCulture, out double number)
                ? new SheetCell(raw, number)
                : new SheetCell(raw, null);
        }
        return new SheetCell(raw, null);
    }

    /// <summary>The zero-based column of a reference such as <c>AB12</c>.</summary>
    private static int ColumnIndex(string reference)
    {
        int column = 0;
        foreach (char c in reference)
        {
            if (c is < 'A' or > 'Z')
            {
                break;
            }
            column = (column * 26) + (c - 'A' + 1);
        }
        return column - 1;
    }
}
