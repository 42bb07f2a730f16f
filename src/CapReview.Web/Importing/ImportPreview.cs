using CapReview.Engine.Specifications;

namespace CapReview.Web.Importing;

/// <summary>The two layouts an import understands.</summary>
public enum ImportShape
{
    /// <summary>One row per cash-flow element: type, label, category, amounts, periods, step, growth.</summary>
    PerElement,

    /// <summary>One row per period, one column per line item.</summary>
    PerPeriod,
}

/// <summary>One bad cell: the row and column as the user's spreadsheet shows them, and what is wrong.</summary>
public sealed record ImportProblem(int Row, string Column, string Reason);

/// <summary>An element to be created and the row of the file it came from (the first, for a run of periods).</summary>
public sealed record ImportedElement(ElementSpec Spec, int Row);

/// <summary>
/// What an import would do, shown before anything changes: the elements it would create, the horizon they need,
/// and every bad cell. It can be applied only when there are no problems.
/// </summary>
public sealed record ImportPreview(ImportShape Shape, IReadOnlyList<ImportedElement> Elements, int Horizon, IReadOnlyList<ImportProblem> Problems)
{
    public bool CanApply => Problems.Count == 0 && Elements.Count > 0 && !NeedsMarkChoice;

    /// <summary>The field separator CsvHelper found in a CSV file; null for a workbook.</summary>
    public char? Separator { get; init; }

    /// <summary>What the file's own numbers say about its decimal mark.</summary>
    public DecimalMarkGuess? Detected { get; init; }

    /// <summary>The decimal mark the text numbers were read with; null when the caller gave a culture instead.</summary>
    public DecimalMark? Mark { get; init; }

    /// <summary>True when the person chose <see cref="Mark"/> rather than the file's numbers deciding it.</summary>
    public bool MarkChosen { get; init; }

    /// <summary>True when the file's numbers leave the mark open and nobody chose one: the preview asks before anything is applied.</summary>
    public bool NeedsMarkChoice => Mark is not null && !MarkChosen && Detected is { Ambiguous: true };

    /// <summary>Every number read from text, as written and as read.</summary>
    public IReadOnlyList<ParsedNumber> Parsed { get; init; } = [];

    public static ImportPreview Failed(ImportShape shape, IReadOnlyList<ImportProblem> problems) => new(shape, [], 0, problems);
}

/// <summary>What a shape read: the elements, and the column (as the user sees it) of a field of the k-th element.</summary>
public sealed record ShapeReading(IReadOnlyList<ImportedElement> Elements, Func<int, string, string> ColumnOf);
