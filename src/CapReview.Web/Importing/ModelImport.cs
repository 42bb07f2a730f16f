using System.Globalization;
using System.Text.RegularExpressions;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;

namespace CapReview.Web.Importing;

/// <summary>
/// Reads a CSV or XLSX file into the elements of a proposal's model, without changing anything: the caller shows
/// the preview and applies it only when the user confirms and there are no problems. Each element read is checked
/// by the engine as the editor would check it, and every problem is reported against the cell it came from.
/// </summary>
public static partial class ModelImport
{
    /// <summary>Reads <paramref name="bytes"/>, named <paramref name="fileName"/>, with text numbers in <paramref name="numbers"/>.</summary>
    public static ImportPreview Read(string fileName, byte[] bytes, CultureInfo numbers, int periodsPerYear = 1) => Read(fileName, bytes, numbers, null, periodsPerYear);

    /// <summary>
    /// Reads <paramref name="bytes"/> with text numbers in <paramref name="mark"/>, or, when null, in the mark the file's
    /// own numbers show (<see cref="DecimalMarkDetection"/>). A file whose numbers leave the mark open reads with a
    /// decimal point but cannot be applied until the person chooses, since the two readings differ a thousandfold.
    /// </summary>
    public static ImportPreview Read(string fileName, byte[] bytes, DecimalMark? mark, int periodsPerYear = 1) => Read(fileName, bytes, null, mark, periodsPerYear);

    private static ImportPreview Read(string fileName, byte[] bytes, CultureInfo? culture, DecimalMark? mark, int periodsPerYear)
    {
        ArgumentNullException.ThrowIfNull(fileName);
        ArgumentNullException.ThrowIfNull(bytes);
        if (bytes.Length > ImportLimits.MaxBytes)
        {
            return Failed($"The file is {bytes.Length / 1024.0:N0} KiB; at most {ImportLimits.MaxBytes / 1024:N0} KiB is read.");
        }
        SheetGrid grid;
        try
        {
            grid = IsWorkbook(fileName, bytes) ? XlsxSheetReader.Read(bytes) : CsvSheetReader.Read(bytes);
        }
        catch (UnreadableSheetException ex)
        {
            return Failed(ex.Message);
        }
        int header = -1;
        ImportShape shape = ImportShape.PerElement;
        for (int r = 0; r < grid.Rows.Count && header < 0; r++)
        {
            if (PeriodRowsShape.IsHeader(grid.Rows[r]))
            {
                (header, shape) = (r, ImportShape.PerPeriod);
            }
            else if (ElementRowsShape.IsHeader(grid.Rows[r]))
            {
                (header, shape) = (r, ImportShape.PerElement);
            }
        }
        if (header < 0)
        {
            return Failed("No header row found: the per-element shape has a column named “type”, the per-period shape starts with a column named “period”.");
        }
        DecimalMarkGuess detected = DecimalMarkDetection.Detect(grid);
        DecimalMark used = mark ?? detected.Mark ?? DecimalMark.Point;
        CultureInfo numbers = culture ?? DecimalMarks.Culture(used);
        var problems = new List<ImportProblem>();
        if (culture is null && mark is null && detected.Conflict)
        {
            problems.Add(new(0, "", $"The file mixes decimal marks ({detected.Evidence}): choose the one it uses, or correct the file."));
        }
        var read = new CellReading(numbers, problems);
        ShapeReading reading = shape == ImportShape.PerPeriod
            ? PeriodRowsShape.Read(grid, header, read)
            : ElementRowsShape.Read(grid, header, read);
        if (problems.Count == 0 && reading.Elements.Count == 0)
        {
            problems.Add(new(grid.Rows[header].Number, "", "The file has a header but no amounts below it."));
        }
        int horizon = Math.Max(1, reading.Elements.Select(e => LastPeriod(e.Spec)).DefaultIfEmpty(1).Max());
        if (problems.Count == 0)
        {
            CheckWithEngine(reading, horizon, periodsPerYear, problems);
        }
        ImportPreview preview = problems.Count > 0
            ? ImportPreview.Failed(shape, problems)
            : new ImportPreview(shape, reading.Elements, horizon, []);
        return preview with
        {
            Separator = grid.Separator,
            Detected = detected,
            Mark = culture is null ? used : null,
            MarkChosen = mark is not null,
            Parsed = read.Parsed,
        };

        ImportPreview Failed(string reason) => ImportPreview.Failed(ImportShape.PerElement, [new ImportProblem(0, "", reason)]);
    }

    private static bool IsWorkbook(string fileName, byte[] bytes) =>
        fileName.EndsWith(".xlsx", StringComparison.OrdinalIgnoreCase)
        || (bytes.Length >= 4 && bytes[0] == 'P' && bytes[1] == 'K' && bytes[2] == 3 && bytes[3] == 4);

    private static int LastPeriod(ElementSpec e) => Math.Max(e.Period ?? 0, Math.Max(e.First ?? 0, e.Last ?? 0));

    /// <summary>Runs the elements through the engine's reader (any MARR will do) and puts its errors on their cells.</summary>
    private static void CheckWithEngine(ShapeReading reading, int horizon, int periodsPerYear, List<ImportProblem> problems)
    {
        var spec = new ModelSpec
        {
            Horizon = horizon,
            PeriodsPerYear = periodsPerYear,
            Rate = new RateSpec { Value = 0.1, Basis = RateBasis.Effective },
            Elements = [.. reading.Elements.Select(e => e.Spec)],
            // Constant-money elements without their own escalation take the model's inflation, set in the editor.
            Inflation = reading.Elements.Any(e => e.Spec.Money is not null) ? new InflationSpec { Rate = 0 } : null,
        };
        foreach (var error in SpecificationReader.Read(spec).Errors)
        {
            Match path = ElementPath().Match(error.Field);
            if (path.Success && int.TryParse(path.Groups["index"].Value, CultureInfo.InvariantCulture, out int k) && k < reading.Elements.Count)
            {
                string field = path.Groups["field"].Value;
                problems.Add(new(reading.Elements[k].Row, reading.ColumnOf(k, field.Length == 0 ? "type" : field), error.Message));
            }
            else
            {
                problems.Add(new(0, error.Field, error.Message));
            }
        }
    }

    [GeneratedRegex(@"^elements\[(?<index>\d+)\]\.?(?<field>\w*)")]
    private static partial Regex ElementPath();
}
