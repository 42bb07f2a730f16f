using CapReview.Engine.CashFlows;
using CapReview.Engine.Inflation;
using CapReview.Engine.Specifications;

namespace CapReview.Web.Importing;

/// <summary>
/// The per-element shape: a header row naming the columns (any order, any case), then one element per row. The
/// columns are the element grid's: type and amount are required; a field the type does not use must be blank (or 0).
/// </summary>
public static class ElementRowsShape
{
    public static readonly IReadOnlyList<string> Columns = ["type", "label", "category", "amount", "period", "first", "last", "every", "step", "growth", "money", "escalation", "expensed"];

    private static readonly string[] Required = ["type", "amount"];
    private static readonly string[] TypeFields = ["period", "first", "last", "every", "step", "growth"];

    private const string Types = "single, uniform, arithmetic, geometric, recurring";
    private const string Categories = "capital, operating, revenue, salvage, tax";
    private const string Moneys = "actual, constant";

    /// <summary>True when a row is this shape's header: it names a type column.</summary>
    public static bool IsHeader(SheetRow row) => row.Cells.Any(c => Name(c) == "type");

    public static ShapeReading Read(SheetGrid grid, int headerIndex, CellReading read)
    {
        SheetRow header = grid.Rows[headerIndex];
        var at = new Dictionary<string, int>(StringComparer.Ordinal);
        var names = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int k = 0; k < header.Cells.Count; k++)
        {
            string name = Name(header[k]);
            string column = $"{SheetGrid.ColumnLetters(k)} · {header[k].Text.Trim()}";
            if (name.Length == 0)
            {
                continue;
            }
            if (!Columns.Contains(name))
            {
                read.Add(header.Number, column, $"Not a column of the per-element shape; the columns are {string.Join(", ", Columns)}.");
            }
            else if (!at.TryAdd(name, k))
            {
                read.Add(header.Number, column, $"The column “{name}” appears twice.");
            }
            else
            {
                names[name] = column;
            }
        }
        foreach (string required in Required.Where(r => !at.ContainsKey(r)))
        {
            read.Add(header.Number, required, $"The header has no “{required}” column.");
        }
        var elements = new List<ImportedElement>();
        var reading = new ShapeReading(elements, (_, field) => names.GetValueOrDefault(field, field));
        if (read.Problems.Count > 0)
        {
            return reading;
        }
        // Reads the cell of a named column; a column the file does not have reads as blank.
        int Column(string name) => at.TryGetValue(name, out int k) ? k : int.MaxValue;
        string Named(string name) => names.GetValueOrDefault(name, name);
        foreach (SheetRow row in grid.Rows.Skip(headerIndex + 1).Where(r => !r.IsBlank))
        {
            ElementKind? type = read.Word<ElementKind>(row, Column("type"), Named("type"), null, Types);
            var uses = new Func<string, bool>(field => type is ElementKind kind && ElementFields.Uses(kind, field));
            foreach (string field in TypeFields)
            {
                SheetCell cell = row[Column(field)];
                if (type is not null && !uses(field) && !cell.IsBlank && cell.Number != 0 && cell.Text.Trim() != "0")
                {
                    read.Add(row.Number, Named(field), $"A {type.Value.ToString().ToLowerInvariant()} element has no {field}; leave it blank.");
                }
            }
            MoneyBasis? money = read.Word<MoneyBasis>(row, Column("money"), Named("money"), MoneyBasis.Actual, Moneys);
            if (money != MoneyBasis.Constant && !row[Column("escalation")].IsBlank)
            {
                read.Add(row.Number, Named("escalation"), "Only an element in constant money escalates; leave it blank or set money to constant.");
            }
            string Periods(string field) => field == "period" ? "Give the period of the amount (0 is now)." : $"Give the {field} period of the series.";
            elements.Add(new ImportedElement(new ElementSpec
            {
                Type = type,
                Label = row[Column("label")].Text.Trim(),
                Category = read.Word<CashFlowCategory>(row, Column("category"), Named("category"), CashFlowCategory.Operating, Categories),
                Amount = read.Number(row, Column("amount"), Named("amount"), true, "Give the amount: positive received, negative paid."),
                Period = uses("period") ? read.Whole(row, Column("period"), Named("period"), true, Periods("period")) : null,
                First = uses("first") ? read.Whole(row, Column("first"), Named("first"), true, Periods("first")) : null,
                Last = uses("last") ? read.Whole(row, Column("last"), Named("last"), true, Periods("last")) : null,
                Every = uses("every") ? read.Whole(row, Column("every"), Named("every"), true, "Give the interval in periods.") : null,
                Step = uses("step") ? read.Number(row, Column("step"), Named("step"), true, "Give the change per period.") : null,
                Growth = uses("growth") ? read.Rate(row, Column("growth"), Named("growth"), true) : null,
                Money = money == MoneyBasis.Constant ? MoneyBasis.Constant : null,
                Escalation = money == MoneyBasis.Constant ? read.Rate(row, Column("escalation"), Named("escalation"), false) : null,
                Expensed = read.YesOrBlank(row, Column("expensed"), Named("expensed")),
            }, row.Number));
        }
        return reading;
    }

    private static string Name(SheetCell cell) => cell.Text.Trim().ToLowerInvariant();
}
