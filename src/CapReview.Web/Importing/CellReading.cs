using System.Globalization;

namespace CapReview.Web.Importing;

/// <summary>
/// Reads one cell as a number, a whole number or one of a set of words, adding a problem naming the row and column
/// when it cannot. Text numbers are read in the culture the user chose for the file; stored numbers as they are.
/// </summary>
public sealed class CellReading(CultureInfo numbers, List<ImportProblem> problems)
{
    public CultureInfo Numbers { get; } = numbers;

    public IReadOnlyList<ImportProblem> Problems => problems;

    public void Add(int row, string column, string reason) => problems.Add(new(row, column, reason));

    /// <summary>A number, or null (with a problem) when it is not one; null without a problem when blank and not <paramref name="required"/>.</summary>
    public double? Number(SheetRow row, int column, string name, bool required, string blankReason = "Give a number.")
    {
        SheetCell cell = row[column];
        if (cell.Number is double stored)
        {
            return stored;
        }
        string text = cell.Text.Trim().Replace('−', '-');
        if (text.Length == 0)
        {
            if (required)
            {
                Add(row.Number, name, blankReason);
            }
            return null;
        }
        if (double.TryParse(text, NumberStyles.Float | NumberStyles.AllowThousands, Numbers, out double value) && double.IsFinite(value))
        {
            return value;
        }
        Add(row.Number, name, $"“{cell.Text.Trim()}” is not a number (decimal mark “{Numbers.NumberFormat.NumberDecimalSeparator}”).");
        return null;
    }

    /// <summary>A rate: a fraction (0.03) or a percentage with its sign (3%). A bare number above 1 is refused as ambiguous.</summary>
    public double? Rate(SheetRow row, int column, string name, bool required)
    {
        SheetCell cell = row[column];
        string text = cell.Text.Trim();
        if (cell.Number is null && text.EndsWith('%'))
        {
            var percent = new SheetRow(row.Number, [new SheetCell(text.TrimEnd('%').Trim(), null)]);
            return Number(percent, 0, name, true) / 100.0;
        }
        double? value = Number(row, column, name, required);
        if (value is double v && Math.Abs(v) > 1)
        {
            Add(row.Number, name, $"{v.ToString(Numbers)} is out of range: write a rate as a fraction (0.03) or as a percentage with its sign (3%).");
            return null;
        }
        return value;
    }

    /// <summary>A whole number, or null (with a problem) when it is not one.</summary>
    public int? Whole(SheetRow row, int column, string name, bool required, string blankReason)
    {
        double? value = Number(row, column, name, required, blankReason);
        if (value is not double v)
        {
            return null;
        }
        if (v != Math.Floor(v) || v < 0 || v > int.MaxValue)
        {
            Add(row.Number, name, $"“{row[column].Text.Trim()}” is not a whole number of periods.");
            return null;
        }
        return (int)v;
    }

    /// <summary>One of <typeparamref name="T"/>'s names (case and spaces ignored), <paramref name="blank"/> when empty.</summary>
    public T? Word<T>(SheetRow row, int column, string name, T? blank, string choices)
        where T : struct, Enum
    {
        string text = row[column].Text.Trim();
        if (text.Length == 0)
        {
            if (blank is null)
            {
                Add(row.Number, name, $"Give one of: {choices}.");
            }
            return blank;
        }
        if (Enum.TryParse(text.Replace(" ", "", StringComparison.Ordinal).Replace("-", "", StringComparison.Ordinal), ignoreCase: true, out T value)
            && Enum.IsDefined(value) && !int.TryParse(text, out _))
        {
            return value;
        }
        Add(row.Number, name, $"“{text}” is not one of: {choices}.");
        return null;
    }
}
