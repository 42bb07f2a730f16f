using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Web.Exports;
using CapReview.Web.Importing;
using CapReview.Web.Tests.Api;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Exports;

public sealed class VersionExportTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static readonly ElementSpec[] Elements =
    [
        new() { Type = ElementKind.Single, Label = "Kiln", Category = CashFlowCategory.Capital, Period = 0, Amount = -90_000 },
        new() { Type = ElementKind.Uniform, Label = "Gas saved", Category = CashFlowCategory.Operating, First = 1, Last = 8, Amount = 17_500 },
        new() { Type = ElementKind.Arithmetic, Label = "Upkeep", Category = CashFlowCategory.Operating, First = 1, Last = 8, Amount = -1_000, Step = -200 },
        new() { Type = ElementKind.Geometric, Label = "Heat sold", Category = CashFlowCategory.Revenue, First = 1, Last = 8, Amount = 2_000, Growth = 0.04 },
        new() { Type = ElementKind.Single, Label = "Scrap", Category = CashFlowCategory.Salvage, Period = 8, Amount = 6_000 },
    ];

    private async Task<(ProposalView Proposal, MarrPolicyVersion Policy)> DraftAsync(string leadId = "version-export-lead")
    {
        var admin = Actor.Of("version-export-admin", "Admin", Role.Administrator);
        var policy = await factory.Services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.09, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Version export policy"), CancellationToken.None);
        var lead = Actor.Of(leadId, "Lead", Role.ProjectLead);
        var draft = await factory.Services.GetRequiredService<ProposalService>().CreateDraftAsync(lead, new ProposalDraft("Kiln heat recovery", "",
            ProposalCategory.CostReduction, RiskClass.Standard, new ProposalAssumptions { Model = new ModelSpec { Horizon = 8, Elements = Elements } }, null), CancellationToken.None);
        return (draft, policy);
    }

    [Fact]
    public async Task The_workbook_states_the_measures_and_its_elements_and_cash_flows_import_again_unchanged()
    {
        var (proposal, policy) = await DraftAsync();
        var tables = VersionExport.Tables(proposal, proposal.Latest, policy, "EUR");
        Assert.Equal(["summary", "elements", "cash-flows", "discounting"], tables.Select(t => t.Name));
        byte[] workbook = XlsxExport.Write([.. tables.Select(t => t.Table)]);
        using (var document = SpreadsheetDocument.Open(new MemoryStream(workbook), false))
        {
            Assert.Equal(["Summary", "Elements", "Cash flows", "Discounting", "Notes"], document.WorkbookPart!.Workbook.Descendants<Sheet>().Select(s => s.Name!.Value));
        }

        // The workbook imports through its Elements sheet to the very elements it was made from.
        var again = ModelImport.Read("kiln.xlsx", workbook, CultureInfo.GetCultureInfo("de-DE"));
        Assert.True(again.CanApply, string.Join("; ", again.Problems));
        Assert.Equal(Elements, again.Elements.Select(e => e.Spec with { Escalation = null, Money = null }));

        // The cash-flow table, as CSV, imports in the per-period shape to the same net flows.
        var cashFlows = ModelImport.Read("kiln.csv", CsvExport.Write(tables.Single(t => t.Name == "cash-flows").Table), CultureInfo.InvariantCulture);
        Assert.True(cashFlows.CanApply, string.Join("; ", cashFlows.Problems));
        Assert.Equal(ImportShape.PerPeriod, cashFlows.Shape);
        var expected = SpecificationReader.Read(new ModelSpec { Horizon = 8, Rate = new RateSpec { Value = 0.09 }, Elements = Elements }).Value!.Model.NetFlows;
        var actual = SpecificationReader.Read(new ModelSpec { Horizon = cashFlows.Horizon, Rate = new RateSpec { Value = 0.09 }, Elements = [.. cashFlows.Elements.Select(e => e.Spec)] }).Value!.Model.NetFlows;
        Assert.Equal(expected.Count, actual.Count);
        for (int t = 0; t < expected.Count; t++)
        {
            Assert.Equal(expected[t], actual[t], 9);
        }

        // Outside reference: Microsoft.VisualBasic.Financial.NPV of the net flows at 9 %, plus the flow now.
        var summary = tables.Single(t => t.Name == "summary").Table.Rows.ToDictionary(r => (string)r[0]!, r => r[1]);
        double[] later = [.. expected.Skip(1)];
        double npv = expected[0] + Financial.NPV(0.09, ref later);
        Assert.Equal(npv, (double)summary["Present worth"]!, 6);
        Assert.Equal(0.09, (double)summary["MARR (a year, effective)"]!, 12);
        var discounting = tables.Single(t => t.Name == "discounting").Table.Rows;
        Assert.Equal(npv, (double)discounting[^1][4]!, 6);
    }

    [Fact]
    public async Task The_downloads_answer_by_table_and_name_a_table_that_is_not_there()
    {
        var (lead, userId) = await factory.TokenClientAsync("version.export@tarnby.example", CapReview.Web.Identity.RoleNames.ProjectLead);
        using HttpClient client = lead;
        var (proposal, _) = await DraftAsync(userId);
        using var csv = await client.GetAsync($"/proposals/{proposal.Id}/versions/1/csv/elements");
        Assert.Equal(System.Net.HttpStatusCode.OK, csv.StatusCode);
        Assert.Equal($"{proposal.Reference.ToLowerInvariant()}-v1-elements.csv", csv.Content.Headers.ContentDisposition!.FileNameStar ?? csv.Content.Headers.ContentDisposition.FileName);
        using var missing = await client.GetAsync($"/proposals/{proposal.Id}/versions/1/csv/depreciation");
        Assert.Equal(System.Net.HttpStatusCode.NotFound, missing.StatusCode);
        Assert.Contains("summary, elements, cash-flows, discounting", await missing.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        using var noVersion = await client.GetAsync($"/proposals/{proposal.Id}/versions/7/xlsx");
        Assert.Equal(System.Net.HttpStatusCode.NotFound, noVersion.StatusCode);
    }
}
