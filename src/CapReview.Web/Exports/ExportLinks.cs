namespace CapReview.Web.Exports;

/// <summary>The links of the downloads beside a CSV link.</summary>
public static class ExportLinks
{
    /// <summary>The notes table of a cycle's CSV download: the same link with <c>table=notes</c> added to its query.</summary>
    public static string NotesLink(string csvLink)
    {
        ArgumentNullException.ThrowIfNull(csvLink);
        return csvLink + (csvLink.Contains('?', StringComparison.Ordinal) ? "&" : "?") + "table=notes";
    }
}
