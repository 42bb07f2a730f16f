using CapReview.Reviews.Display;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// One change between two versions: the machine's <see cref="Path"/> and JSON values (for the API), and the same in
/// words: what it belongs to (<see cref="Subject"/>, e.g. "Element 2, ‘Two operator positions saved’"), which part
/// (<see cref="What"/>, e.g. "amount", or "added"/"removed" for a whole element), both values, and its effect on present
/// worth (the later version's present worth less the same with this change alone undone; null where either cannot be evaluated).
/// </summary>
public sealed record FieldChange(string Path, string? Before, string? After, string Subject, string What, ChangeValue BeforeValue, ChangeValue AfterValue,
    double? PresentWorthEffect)
{
    /// <summary>The change as one sentence: "Element 2, ‘Two operator positions saved’: amount 78,000 → 39,000".</summary>
    public string Sentence(NumberDisplay format)
    {
        ArgumentNullException.ThrowIfNull(format);
        return What switch
        {
            "added" => $"{Subject}: added ({AfterValue.Show(format)})",
            "removed" => $"{Subject}: removed ({BeforeValue.Show(format)})",
            "" => $"{Subject}: {BeforeValue.Show(format)} → {AfterValue.Show(format)}",
            _ => $"{Subject}: {What} {BeforeValue.Show(format)} → {AfterValue.Show(format)}",
        };
    }
}
