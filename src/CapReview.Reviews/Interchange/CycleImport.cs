namespace CapReview.Reviews.Interchange;

/// <summary>
/// Where an imported cycle came from: the document's SHA-256, the installation that exported it (as the document
/// names itself), who imported it and when. Decisions and sign-offs of the document are stored under
/// <see cref="CycleImporter.ImportedPrefix"/> names, never as acts of this installation's members; this row says
/// whose import put them there. Written once.
/// </summary>
public sealed class CycleImport
{
    private CycleImport()
    {
    }

    public CycleImport(int budgetCycleId, string documentSha256, string installation, string importedBy, string importedByName, DateTimeOffset importedAt,
        string signature)
    {
        Signature = signature;
        BudgetCycleId = budgetCycleId;
        DocumentSha256 = documentSha256;
        Installation = installation;
        ImportedBy = importedBy;
        ImportedByName = importedByName;
        ImportedAt = importedAt;
    }

    public int Id { get; private set; }

    public int BudgetCycleId { get; private set; }

    public string DocumentSha256 { get; private set; } = "";

    /// <summary>The exporting installation as the document names it; "not named" for documents that do not say.</summary>
    public string Installation { get; private set; } = "";

    public string ImportedBy { get; private set; } = "";

    public string ImportedByName { get; private set; } = "";

    public DateTimeOffset ImportedAt { get; private set; }

    /// <summary>"unsigned", or who signed the document and that the signature was verified against a trusted certificate.</summary>
    public string Signature { get; private set; } = "unsigned";
}
