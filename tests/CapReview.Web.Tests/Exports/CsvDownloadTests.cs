using System.Net;
using System.Text.Json;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Identity;
using CapReview.Web.Tests.Api;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Exports;

/// <summary>
/// Every CSV download of the app (a cycle's ranking and portfolio, each table of a proposal version) on names people
/// typed to break out of a cell: whatever a spreadsheet opens, every line is as wide as the table and no cell can run
/// as a formula, the title and notes included.
/// </summary>
public sealed class CsvDownloadTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private const string CycleName = "Hall 3,=1+2,@SUM(A1)";
    private const string Title = "Press,-1+2,+cmd|' /C calc'!A0";

    [Fact]
    public async Task Every_csv_download_keeps_names_that_look_like_formulas_or_hold_commas_inside_their_cells()
    {
        var (cycleId, proposalId, lead) = await CycleAsync();
        var (board, _) = await factory.TokenClientAsync("csv.board@tarnby.example", RoleNames.Reviewer);
        using (board)
        using (lead)
        {
            // Every table a version offers: the answer for one that is not there names them all.
            using var unknown = await lead.GetAsync($"/proposals/{proposalId}/versions/1/csv/none");
            Assert.Equal(HttpStatusCode.NotFound, unknown.StatusCode);
            string detail = JsonDocument.Parse(await unknown.Content.ReadAsStringAsync()).RootElement.GetProperty("detail").GetString()!;
            string[] tables = detail[(detail.IndexOf("it has ", StringComparison.Ordinal) + "it has ".Length)..].TrimEnd('.').Split(", ");
            Assert.Equal(["summary", "elements", "cash-flows", "discounting", "depreciation", "after-tax"], tables);

            var downloads = new List<(HttpClient Client, string Path)>
            {
                (board, $"/cycles/{cycleId}/ranking/csv"),
                (board, $"/cycles/{cycleId}/ranking/csv?basis=afterTax&shift=1"),
                (board, $"/cycles/{cycleId}/portfolio/csv"),
                (board, $"/cycles/{cycleId}/portfolio/csv?objective=annualWorth&limit=90000"),
            };
            downloads.AddRange(tables.Select(t => (lead, $"/proposals/{proposalId}/versions/1/csv/{t}")));
            downloads.Add((lead, $"/proposals/{proposalId}/versions/1/csv/notes"));
            downloads.Add((board, $"/cycles/{cycleId}/ranking/csv?table=notes"));
            foreach (var (client, path) in downloads)
            {
                using var answer = await client.GetAsync(path);
                Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
                Assert.Equal("text/csv", answer.Content.Headers.ContentType?.MediaType);
                var cells = SpreadsheetCells.Read(await answer.Content.ReadAsByteArrayAsync());
                int width = cells[0].Count;
                Assert.All(cells, row => Assert.True(row.Count == width, $"{path}: a line of {row.Count} cells in a table of {width}: {string.Join(" | ", row)}"));
                var formulas = cells.SelectMany(r => r).Where(SpreadsheetCells.MayRunAsFormula).ToList();
                Assert.True(formulas.Count == 0, $"{path}: cells a spreadsheet may run: {string.Join(" | ", formulas)}");
                // The typed names reach the cells whole: a proposal's title in the ranking and its summary, a cycle's name in the notes beside the table's title.
                string? name = path.Contains("table=notes", StringComparison.Ordinal) ? CycleName
                    : path.StartsWith("/cycles", StringComparison.Ordinal) || path.EndsWith("/summary", StringComparison.Ordinal) ? Title : null;
                Assert.True(name is null || cells.Any(row => row.Any(c => c.Contains(name, StringComparison.Ordinal))), $"{path}: {name} is not in a cell of its own");
            }
            // A plain table: the header on the first line; the title and cautions in the notes table beside it.
            var ranking = SpreadsheetCells.Read(await board.GetByteArrayAsync($"/cycles/{cycleId}/ranking/csv"));
            Assert.Equal("Rank", ranking[0][0]);
            Assert.Equal("Cost reduction", ranking[1][ranking[0].IndexOf("Category")]);
            var notes = SpreadsheetCells.Read(await board.GetByteArrayAsync($"/cycles/{cycleId}/ranking/csv?table=notes"));
            Assert.Equal(["Table", "Note"], notes[0]);
            Assert.All(notes.Skip(1), row => Assert.Equal("Ranking " + CycleName, row[0]));
            Assert.Contains(notes, row => row[1].StartsWith("Estimates, not advice", StringComparison.Ordinal));
        }
    }

    /// <summary>A cycle with a hostile name, two proposals of a lead in a group, the first with tax settings so that its version has every table.</summary>
    private async Task<(int CycleId, int ProposalId, HttpClient Lead)> CycleAsync()
    {
        var admin = Actor.Of("csv-admin", "CSV Admin", Role.Administrator);
        var services = factory.Services;
        var marr = await services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "CSV policy"), CancellationToken.None);
        var cycle = await services.GetRequiredService<CycleService>().CreateAsync(admin,
            new NewBudgetCycle(CycleName, 100_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var (leadClient, leadId) = await factory.TokenClientAsync("csv.lead@tarnby.example", RoleNames.ProjectLead);
        var lead = Actor.Of(leadId, "CSV Lead", Role.ProjectLead);
        var proposals = services.GetRequiredService<ProposalService>();
        var first = await proposals.CreateDraftAsync(lead, new ProposalDraft(Title, "@SUM(A1)", ProposalCategory.CostReduction, RiskClass.Standard,
            new ProposalAssumptions
            {
                Model = Model("=Kiln", "Gas,=saved", 80_000, 16_000),
                Tax = new TaxSpec
                {
                    IncomeTaxRate = 0.25,
                    Depreciation = new DepreciationSpec { Method = DepreciationMethod.Macrs, PropertyClass = Engine.Depreciation.MacrsClass.SevenYear },
                },
            }, null), CancellationToken.None);
        var second = await proposals.CreateDraftAsync(lead, new ProposalDraft("-Dryer,=2", "", ProposalCategory.CostReduction, RiskClass.Standard,
            new ProposalAssumptions { Model = Model("+Dryer", "@Steam", 50_000, 9_000) }, null), CancellationToken.None);
        await proposals.SubmitAsync(lead, first.Id, cycle.Id, first.Revision, CancellationToken.None);
        await proposals.SubmitAsync(lead, second.Id, cycle.Id, second.Revision, CancellationToken.None);
        await services.GetRequiredService<PortfolioRulesService>().SaveGroupAsync(admin, cycle.Id,
            new GroupDraft("=Line,+3", false, [first.Id, second.Id]), CancellationToken.None);
        return (cycle.Id, first.Id, leadClient);
    }

    private static ModelSpec Model(string costLabel, string savingLabel, double cost, double saving) => new()
    {
        Horizon = 10,
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = costLabel, Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
            new ElementSpec { Type = ElementKind.Uniform, Label = savingLabel, Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving },
        ],
    };
}
