using CapReview.Engine.Depreciation;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Tests.Proposals;

/// <summary>
/// An outlay's own class or life travels in a version's canonical JSON only when chosen: versions stored before it
/// read, write and hash exactly as before.
/// </summary>
public class OutlayClassDocumentTests
{
    // A version's canonical JSON as written before the choice: an addition at year 4 among the elements, after tax.
    private const string Stored = """{"model":{"horizon":8,"rate":{"value":0.1},"elements":[{"id":"e1","type":"single","label":"Kiln","category":"capital","period":0,"amount":-300000},{"id":"e2","type":"single","label":"Kiln house","category":"capital","period":4,"amount":-40000},{"id":"e3","type":"uniform","label":"Fuel saved","category":"revenue","first":1,"last":8,"amount":70000}]},"tax":{"incomeTaxRate":0.25,"depreciation":{"method":"macrs","propertyClass":"sevenYear"}}}""";

    private static string Sha256(string text) =>
        Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(text)));

    private static ProposalAssumptions With(ProposalAssumptions assumptions, OutlayClass? depreciatedAs)
    {
        var elements = assumptions.Model.Elements!;
        return assumptions with { Model = assumptions.Model with { Elements = [elements[0], elements[1]! with { DepreciatedAs = depreciatedAs }, elements[2]] } };
    }

    [Fact]
    public void A_version_stored_before_the_choice_reads_and_hashes_as_before()
    {
        var assumptions = AssumptionsDocument.Deserialize(Stored);
        Assert.Null(assumptions.Model.Elements![1]!.DepreciatedAs);
        Assert.Equal(Stored, AssumptionsDocument.Serialize(assumptions));
        // Outside reference: SHA-256 of the stored UTF-8 text, computed here with System.Security.Cryptography.
        Assert.Equal(Sha256(Stored), AssumptionsDocument.Hash(AssumptionsDocument.Serialize(assumptions)));
        // The first cost's method, chosen as an empty choice, is stored as nothing.
        Assert.Equal(Stored, AssumptionsDocument.Serialize(With(assumptions, new OutlayClass())));
        Assert.Equal(Stored, AssumptionsDocument.Serialize(AssumptionsDocument.Deserialize(Stored.Replace("\"amount\":-40000}", "\"amount\":-40000,\"depreciatedAs\":{}}", StringComparison.Ordinal))));
    }

    [Fact]
    public void A_class_of_its_own_travels_with_its_element()
    {
        var assumptions = AssumptionsDocument.Deserialize(Stored);
        string written = AssumptionsDocument.Serialize(With(assumptions, new OutlayClass { PropertyClass = MacrsClass.Nonresidential }));
        Assert.Equal(Stored.Replace("\"amount\":-40000}", "\"amount\":-40000,\"depreciatedAs\":{\"propertyClass\":\"nonresidential\"}}", StringComparison.Ordinal), written);
        Assert.Equal(MacrsClass.Nonresidential, AssumptionsDocument.Deserialize(written).Model.Elements![1]!.DepreciatedAs!.PropertyClass);
    }
}
