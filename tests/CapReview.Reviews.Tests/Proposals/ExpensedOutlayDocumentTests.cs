using CapReview.Engine.Specifications;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Tests.Proposals;

/// <summary>
/// The flag that keeps a later capital cost a repair travels in a version's canonical JSON only when set: versions
/// stored before it read, write and hash exactly as before.
/// </summary>
public class ExpensedOutlayDocumentTests
{
    // A version's canonical JSON as written before the flag: an overhaul at year 4 among the elements, after tax.
    private const string Stored = """{"model":{"horizon":8,"rate":{"value":0.1},"elements":[{"id":"e1","type":"single","label":"Kiln","category":"capital","period":0,"amount":-300000},{"id":"e2","type":"single","label":"Relining","category":"capital","period":4,"amount":-40000},{"id":"e3","type":"uniform","label":"Fuel saved","category":"revenue","first":1,"last":8,"amount":70000}]},"tax":{"incomeTaxRate":0.25,"depreciation":{"method":"macrs","propertyClass":"sevenYear"}}}""";

    private static string Sha256(string text) =>
        Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text)));

    [Fact]
    public void A_version_stored_before_the_flag_reads_and_hashes_as_before()
    {
        var assumptions = AssumptionsDocument.Deserialize(Stored);
        Assert.Null(assumptions.Model.Elements![1]!.Expensed);
        Assert.Equal(Stored, AssumptionsDocument.Serialize(assumptions));
        // Outside reference: SHA-256 of the stored UTF-8 text, computed here with System.Security.Cryptography.
        Assert.Equal(Sha256(Stored), AssumptionsDocument.Hash(AssumptionsDocument.Serialize(assumptions)));
    }

    [Fact]
    public void Unticked_is_written_as_absent_and_ticked_travels_with_its_element()
    {
        var assumptions = AssumptionsDocument.Deserialize(Stored);
        ElementSpec relining = assumptions.Model.Elements![1]!;
        var unticked = assumptions with { Model = assumptions.Model with { Elements = [assumptions.Model.Elements[0], relining with { Expensed = false }, assumptions.Model.Elements[2]] } };
        Assert.Equal(Stored, AssumptionsDocument.Serialize(unticked));
        // The same document with "expensed":false, as a program might send it, is stored without it.
        Assert.Equal(Stored, AssumptionsDocument.Serialize(AssumptionsDocument.Deserialize(Stored.Replace("\"amount\":-40000}", "\"amount\":-40000,\"expensed\":false}", StringComparison.Ordinal))));

        var ticked = assumptions with { Model = assumptions.Model with { Elements = [assumptions.Model.Elements[0], relining with { Expensed = true }, assumptions.Model.Elements[2]] } };
        string written = AssumptionsDocument.Serialize(ticked);
        Assert.Equal(Stored.Replace("\"amount\":-40000}", "\"amount\":-40000,\"expensed\":true}", StringComparison.Ordinal), written);
        Assert.True(AssumptionsDocument.Deserialize(written).Model.Elements![1]!.Expensed);
    }
}
