namespace CapReview.Web.Importing;

/// <summary>
/// How much one import may hold. A model has at most 500 elements and 1,200 periods, so a file larger than these
/// limits is a mistake (or an attack) rather than a proposal; it is refused before it is parsed.
/// </summary>
public static class ImportLimits
{
    /// <summary>The largest file read, in bytes (1 MiB).</summary>
    public const long MaxBytes = 1024 * 1024;

    /// <summary>The most rows a sheet may have, the header and notes included.</summary>
    public const int MaxRows = 1_500;

    /// <summary>The most columns a row may have (one per line item in the per-period shape).</summary>
    public const int MaxColumns = 100;

    /// <summary>The most characters a spreadsheet part may expand to, so that a small compressed file cannot fill memory.</summary>
    public const long MaxCharactersInPart = 50_000_000;
}
