using System.Text.RegularExpressions;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;

namespace CapReview.Web.Importing;

/// <summary>
/// The per-period shape: a header row whose first column is <c>period</c> and whose other columns are line items,
/// named <c>Label</c> or <c>Label [category]</c> (operating when none is given); then one row per period. Each line
/// item becomes as few elements as reproduce its column exactly: a run of equal amounts a uniform series, a run of
/// three or more changing by the same step an arithmetic gradient, anything else single amounts. Blank cells are 0.
/// </summary>
public static partial class PeriodRowsShape
{
    private const string Categories = "capital, operating, revenue, salvage, tax";

    public static bool IsHeader(SheetRow row) => row.Cells.Count > 0 && row[0].Text.Trim().Equals("period", StringComparison.OrdinalIgnoreCase);

    public static ShapeReading Read(SheetGrid grid, int headerIndex, CellReading read)
    {
        SheetRow header = grid.Rows[headerIndex];
        var items = new List<(int Column, string Name, string Label, CashFlowCategory Category)>();
        for (int k = 1; k < header.Cells.Count; k++)
        {
            string text = header[k].Text.Trim();
            string name = $"{SheetGrid.ColumnLetters(k)} · {text}";
            if (text.Length == 0)
            {
                if (grid.Rows.Skip(headerIndex + 1).Any(r => !r[k].IsBlank))
                {
                    read.Add(header.Number, SheetGrid.ColumnLetters(k), "This column has amounts but no line-item name in the header.");
                }
                continue;
            }
            Match tagged = CategoryTag().Match(text);
            var category = CashFlowCategory.Operating;
            if (tagged.Success)
            {
                var tag = new SheetRow(header.Number, [new SheetCell(tagged.Groups["category"].Value, null)]);
                category = read.Word<CashFlowCategory>(tag, 0, name, null, Categories) ?? category;
                text = tagged.Groups["label"].Value.Trim();
            }
            items.Add((k, name, text, category));
        }
        if (items.Count == 0)
        {
            read.Add(header.Number, "B", "The header names no line items after the period column.");
        }
        var periods = new SortedDictionary<int, SheetRow>();
        var amounts = items.Select(_ => new SortedDictionary<int, double>()).ToList();
        foreach (SheetRow row in grid.Rows.Skip(headerIndex + 1).Where(r => !r.IsBlank))
        {
            string periodColumn = $"A · {header[0].Text.Trim()}";
            if (read.Whole(row, 0, periodColumn, true, "Give the period of this row (0 is now).") is not int period)
            {
                continue;
            }
            if (!periods.TryAdd(period, row))
            {
                read.Add(row.Number, periodColumn, $"Period {period} is already on row {periods[period].Number}.");
                continue;
            }
            for (int i = 0; i < items.Count; i++)
            {
                if (read.Number(row, items[i].Column, items[i].Name, false) is double amount && amount != 0)
                {
                    amounts[i][period] = amount;
                }
            }
        }
        var elements = new List<ImportedElement>();
        var columnOf = new List<string>();
        for (int i = 0; i < items.Count; i++)
        {
            foreach (ElementSpec spec in Runs(amounts[i], items[i].Label, items[i].Category))
            {
                elements.Add(new ImportedElement(spec, periods[spec.Period ?? spec.First!.Value].Number));
                columnOf.Add(items[i].Name);
            }
        }
        return new ShapeReading(elements, (k, _) => k < columnOf.Count ? columnOf[k] : "");
    }

    /// <summary>The fewest elements that give exactly these amounts, in period order.</summary>
    private static IEnumerable<ElementSpec> Runs(SortedDictionary<int, double> amounts, string label, CashFlowCategory category)
    {
        var points = amounts.ToList();
        int start = 0;
        while (start < points.Count)
        {
            int end = start;
            // Extend over consecutive periods while the amount stays the same …
            while (end + 1 < points.Count && points[end + 1].Key == points[end].Key + 1 && points[end + 1].Value == points[start].Value)
            {
                end++;
            }
            if (end > start)
            {
                yield return new ElementSpec { Type = ElementKind.Uniform, Label = label, Category = category, First = points[start].Key, Last = points[end].Key, Amount = points[start].Value };
                start = end + 1;
                continue;
            }
            // … or changes by the same step (exactly, so the gradient reproduces the cells).
            while (end + 1 < points.Count && points[end + 1].Key == points[end].Key + 1
                && points[end + 1].Value - points[end].Value == points[start + 1 < points.Count ? start + 1 : start].Value - points[start].Value)
            {
                end++;
            }
            if (end - start >= 2)
            {
                yield return new ElementSpec
                {
                    Type = ElementKind.Arithmetic, Label = label, Category = category, First = points[start].Key, Last = points[end].Key,
                    Amount = points[start].Value, Step = points[start + 1].Value - points[start].Value,
                };
                start = end + 1;
                continue;
            }
            yield return new ElementSpec { Type = ElementKind.Single, Label = label, Category = category, Period = points[start].Key, Amount = points[start].Value };
            start++;
        }
    }

    [GeneratedRegex(@"^(?<label>.*)\[(?<category>[^\]]*)\]\s*$")]
    private static partial Regex CategoryTag();
}
