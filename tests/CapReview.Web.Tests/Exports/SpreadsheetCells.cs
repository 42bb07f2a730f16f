using System.Globalization;
using System.Text;

namespace CapReview.Web.Tests.Exports;

/// <summary>
/// A CSV file as a spreadsheet opens it, read here without CsvHelper (the writer under test): RFC 4180 (comma
/// separated, CRLF or LF between records, a field in double quotes may hold commas, quotes doubled and line breaks),
/// with no notion of comment lines, which a spreadsheet does not have either.
/// </summary>
public static class SpreadsheetCells
{
    /// <summary>The characters OWASP's CSV-injection guidance names: a cell starting with one may run as a formula.</summary>
    private static readonly char[] FormulaStarts = ['=', '+', '-', '@', '\t', '\r'];

    public static List<List<string>> Read(byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        string text = Encoding.UTF8.GetString(bytes).TrimStart('\uFEFF');
        var rows = new List<List<string>>();
        var row = new List<string>();
        var cell = new StringBuilder();
        bool quoted = false;
        for (int k = 0; k < text.Length; k++)
        {
            char c = text[k];
            if (quoted)
            {
                if (c == '"' && k + 1 < text.Length && text[k + 1] == '"')
                {
                    cell.Append('"');
                    k++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    cell.Append(c);
                }
            }
            else if (c == '"' && cell.Length == 0)
            {
                quoted = true;
            }
            else if (c == ',')
            {
                row.Add(cell.ToString());
                cell.Clear();
            }
            else if (c is '\r' or '\n')
            {
                if (c == '\r' && k + 1 < text.Length && text[k + 1] == '\n')
                {
                    k++;
                }
                row.Add(cell.ToString());
                cell.Clear();
                rows.Add(row);
                row = [];
            }
            else
            {
                cell.Append(c);
            }
        }
        if (cell.Length > 0 || row.Count > 0)
        {
            row.Add(cell.ToString());
            rows.Add(row);
        }
        return rows;
    }

    /// <summary>Whether a spreadsheet could take the cell for a formula: it starts with one of the characters above and is not a plain number.</summary>
    public static bool MayRunAsFormula(string cell)
    {
        ArgumentNullException.ThrowIfNull(cell);
        return cell.Length > 0 && FormulaStarts.Contains(cell[0])
            && !double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out _);
    }
}
