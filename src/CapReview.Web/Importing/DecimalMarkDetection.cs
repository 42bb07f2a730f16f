using System.Text.RegularExpressions;

namespace CapReview.Web.Importing;

/// <summary>
/// What the text numbers of a file say about its decimal mark: the mark when some number decides it (−480000,50 can
/// only be a decimal comma, 1,234.5 only a decimal point), null when none does (every number whole, or written as
/// 1.234 or 1,234, which either mark reads, a thousandfold apart), with the cell that decided or left it open.
/// </summary>
/// <param name="Mark">The mark the file's numbers show, or null when they leave it open or contradict each other.</param>
/// <param name="Evidence">The cell that decided (or, when open, one that could be read either way), as "row 3: −480000,50"; null when no cell matters.</param>
/// <param name="Conflict">True when some numbers need a point and others a comma.</param>
public sealed record DecimalMarkGuess(DecimalMark? Mark, string? Evidence, bool Conflict = false)
{
    /// <summary>True when the file holds a number the two marks read differently and none of its numbers decides.</summary>
    public bool Ambiguous => Mark is null && Evidence is not null && !Conflict;
}

/// <summary>Looks at every number written as text in a sheet (stored numbers need no mark) to tell its decimal mark.</summary>
public static partial class DecimalMarkDetection
{
    public static DecimalMarkGuess Detect(SheetGrid grid)
    {
        ArgumentNullException.ThrowIfNull(grid);
        string? point = null, comma = null, open = null;
        foreach (SheetRow row in grid.Rows)
        {
            foreach (SheetCell cell in row.Cells.Where(c => c.Number is null))
            {
                string text = cell.Text.Trim();
                string bare = text.Replace('−', '-').TrimStart('+', '-').TrimEnd('%').Trim();
                string where = $"row {row.Number}: {text}";
                if (PointDecides().IsMatch(bare))
                {
                    point ??= where;
                }
                else if (CommaDecides().IsMatch(bare))
                {
                    comma ??= where;
                }
                else if (EitherWay().IsMatch(bare))
                {
                    open ??= where;
                }
            }
        }
        return (point, comma) switch
        {
            ({ } p, { } c) => new DecimalMarkGuess(null, $"{p} needs a decimal point, {c} a decimal comma", Conflict: true),
            ({ } p, null) => new DecimalMarkGuess(DecimalMark.Point, p),
            (null, { } c) => new DecimalMarkGuess(DecimalMark.Comma, c),
            _ => new DecimalMarkGuess(null, open),
        };
    }

    // A point followed by other than three digits, a point after comma-grouped thousands, two or more comma groups, or "0.ddd".
    [GeneratedRegex(@"^(\d+\.(\d{1,2}|\d{4,})|\d{4,}\.\d{3}|\d{1,3}(,\d{3})+\.\d+|\d{1,3}(,\d{3}){2,}|0\.\d+|\.\d+)$", RegexOptions.CultureInvariant)]
    private static partial Regex PointDecides();

    [GeneratedRegex(@"^(\d+,(\d{1,2}|\d{4,})|\d{4,},\d{3}|\d{1,3}(\.\d{3})+,\d+|\d{1,3}(\.\d{3}){2,}|0,\d+|,\d+)$", RegexOptions.CultureInvariant)]
    private static partial Regex CommaDecides();

    // 1.234 or 1,234: a thousand and a quarter, or one and a quarter, depending on the mark.
    [GeneratedRegex(@"^[1-9]\d{0,2}[.,]\d{3}$", RegexOptions.CultureInvariant)]
    private static partial Regex EitherWay();
}
