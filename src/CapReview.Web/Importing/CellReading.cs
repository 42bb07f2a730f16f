using System.Globalization;
using System.Text.RegularExpressions;

namespace CapReview.Web.Importing;

/// <summary>
/// Reads one cell as a number, a whole number or one of a set of words, adding a problem naming the row and column
/// when it cannot. Text numbers are read in the culture the user chose for the file; stored numbers as they are.
/// </summary>
public sealed partial class CellReading(CultureInfo numbers, List<ImportProblem> problems)
{
    private readonly List<ParsedNumber> parsed = [];

    public CultureInfo Numbers { get; } = numbers;

    public IReadOnlyList<ImportProblem> Problems => problems;

    /// <summary>Every number read from text, as written and as read, for the preview to show beside each other.</summary>
    public IReadOnlyList<ParsedNumber> Parsed => parsed;

    public void Add(int row, string column, string reason) => problems.Add(new(row, column, reason));

    /// <summary>A number, or null (with a problem) when it is not one; null without a problem when blank and not <paramref name="required"/>.</summary>
    public double? Number(SheetRow row, int column, string name, bool required, string blankReason = "Give a number.")
    {
        double? value = Parse(row, column, name, required, blankReason);
        if (value is double v && row[column].Number is null)
        {
            parsed.Add(new ParsedNumber(row.Number, name, row[column].Text.Trim(), v));
        }
        return value;
    }

    private double? Parse(SheetRow row, int column, string name, bool required, string blankReason)
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
        // A group mark only between thousands: read leniently, "-480000,50" with a decimal point would be −48,000,050.
        if (Grouped(text) && double.TryParse(text, NumberStyles.Float | NumberStyles.AllowThousands, Numbers, out double value) && double.IsFinite(value))
        {
            return value;
        }
        Add(row.Number, name, $"“{cell.Text.Trim()}” is not a number written with the decimal mark “{Numbers.NumberFormat.NumberDecimalSeparator}” (thousands grouped by “{Numbers.NumberFormat.NumberGroupSeparator}”): check the file's decimal mark above.");
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
            double? share = Parse(percent, 0, name, true, "Give a number.") / 100.0;
            if (share is double s)
            {
                parsed.Add(new ParsedNumber(row.Number, name, text, s, IsRate: true));
            }
            return share;
        }
        double? value = Parse(row, column, name, required, "Give a number.");
        if (value is double r && cell.Number is null)
        {
            parsed.Add(new ParsedNumber(row.Number, name, text, r, IsRate: true));
        }
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

    /// <summary>A yes-or-no cell: true for yes, null for no or blank (the flag's absence).</summary>
    public bool? YesOrBlank(SheetRow row, int column, string name)
    {
        string text = row[column].Text.Trim();
        if (text.Length == 0 || text.Equals("no", StringComparison.OrdinalIgnoreCase))
        {
            return null;
        }
        if (text.Equals("yes", StringComparison.OrdinalIgnoreCase))
        {
            return true;
        }
        Add(row.Number, name, $"“{text}” is not yes or no.");
        return null;
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

    private bool Grouped(string text)
    {
        string group = Numbers.NumberFormat.NumberGroupSeparator;
        if (!text.Contains(group, StringComparison.Ordinal))
        {
            return true;
        }
        string whole = text.Split(Numbers.NumberFormat.NumberDecimalSeparator)[0].TrimStart('+', '-');
        return ThousandGroups().IsMatch(whole.Replace(group, ",", StringComparison.Ordinal));
    }

    [GeneratedRegex(@"^\d{1,3}(,\d{3})+$", RegexOptions.CultureInvariant)]
    private static partial Regex ThousandGroups();
}

/// <summary>A number the import read from text: where, as written, and as read.</summary>
public sealed record ParsedNumber(int Row, string Column, string Written, double Read, bool IsRate = false);
