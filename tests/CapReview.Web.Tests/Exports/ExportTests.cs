using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Web.Exports;
using CapReview.Web.Tests.Api;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Exports;

public sealed class ExportTests(ApiFactory factory) : IClassFixture<ApiFactory>
{
    private static readonly ExportTable Sample = new("Sample export", ["A note", "Estimates, not advice."],
        [new("Reference", ExportKind.Text), new("Worth", ExportKind.Money), new("Rate", ExportKind.Percent), new("Rank", ExportKind.Whole)],
        [["P-0001", -1234.5, 0.0725, 1], ["=HYPERLINK(\"x\")", null, null, 2]]);

    /// <summary>The table's rows from its header row (first cell <paramref name="firstHeader"/>) on, as a spreadsheet reads the file.</summary>
    private static List<string[]> ReadCsv(byte[] bytes, string firstHeader = "Rank") =>
        [.. SpreadsheetCells.Read(bytes).SkipWhile(r => r[0] != firstHeader).Select(r => r.ToArray())];

    [Fact]
    public void Csv_is_a_plain_table_with_the_header_first_and_numbers_as_invariant_numbers()
    {
        byte[] bytes = CsvExport.Write(Sample);
        Assert.Equal([0xEF, 0xBB, 0xBF], bytes[..3]);
        string text = System.Text.Encoding.UTF8.GetString(bytes[3..]);
        Assert.StartsWith("Reference,Worth,Rate,Rank\r\n", text, StringComparison.Ordinal);
        Assert.DoesNotContain("#", text, StringComparison.Ordinal);
        Assert.DoesNotContain("Estimates, not advice.", text, StringComparison.Ordinal);
        var rows = ReadCsv(bytes, "Reference");
        Assert.Equal(3, SpreadsheetCells.Read(bytes).Count);
        Assert.Equal(["Reference", "Worth", "Rate", "Rank"], rows[0]);
        Assert.Equal(["P-0001", "-1234.5", "0.0725", "1"], rows[1]);
        Assert.False(rows[2][0].StartsWith('='), "a formula in a title must not reach a spreadsheet as a formula");
        Assert.Equal("", rows[2][1]);
    }

    [Fact]
    public void The_notes_are_a_plain_table_of_their_own_beside_their_tables_title()
    {
        var rows = SpreadsheetCells.Read(CsvExport.WriteNotes(Sample));
        Assert.Equal([["Table", "Note"], ["Sample export", "A note"], ["Sample export", "Estimates, not advice."]], rows.Select(r => r.ToArray()));
    }

    // Text a person could type into a cycle's name, a proposal's title or an element's label, in the title, the notes,
    // a header and a cell: formula starts (OWASP's = + - @ tab CR), commas, quotes and line breaks.
    private static readonly ExportTable Hostile = new("=HYPERLINK(\"https://elsewhere.example\",\"Open\")",
        ["Cycle Hall 3,=1+2,@SUM(A1)", "+cmd|' /C calc'!A0", "-2+3", "@SUM(A1)", "\tTab first", "\rCR first", "two lines\n=1+1", "says \"quoted\", then =1+1"],
        [new("=Label", ExportKind.Text), new("Worth", ExportKind.Money)],
        [["=1+1", -1234.5], ["Plain, with a comma", 2.0]]);

    [Fact]
    public void Csv_writes_every_line_title_notes_and_headers_included_through_the_same_quoting_and_formula_escaping()
    {
        var notes = SpreadsheetCells.Read(CsvExport.WriteNotes(Hostile));
        var table = SpreadsheetCells.Read(CsvExport.Write(Hostile));
        // Every line is as wide as its table: a comma or line break in a note never makes cells of its own.
        Assert.All(notes.Concat(table), row => Assert.Equal(2, row.Count));
        Assert.DoesNotContain(notes.Concat(table).SelectMany(r => r), SpreadsheetCells.MayRunAsFormula);
        // The title beside each note, then the table's header and cells.
        Assert.All(notes.Skip(1), row => Assert.Equal(notes[1][0], row[0]));
        List<List<string>> cells = [[notes[1][0]], .. notes.Skip(1).Select(r => new List<string> { r[1] }), .. table];
        // Each text whole in its cell; a possible formula behind an apostrophe, which spreadsheets read as "this is text".
        Assert.Equal(
            [
                "'=HYPERLINK(\"https://elsewhere.example\",\"Open\")", "Cycle Hall 3,=1+2,@SUM(A1)", "'+cmd|' /C calc'!A0", "'-2+3", "'@SUM(A1)",
                "'\tTab first", "'\rCR first", "two lines\n=1+1", "says \"quoted\", then =1+1", "'=Label", "'=1+1", "Plain, with a comma",
            ],
            cells.Select(r => r[0]));
        Assert.Equal(["-1234.5", "2"], cells.Skip(cells.Count - 2).Select(r => r[1]));
    }

    [Fact]
    public void Xlsx_stores_numbers_as_numbers_under_a_money_or_percent_format()
    {
        using var document = SpreadsheetDocument.Open(new MemoryStream(XlsxExport.Write(Sample)), false);
        WorkbookPart workbook = document.WorkbookPart!;
        var sheets = workbook.Workbook.Descendants<Sheet>().ToList();
        Assert.Equal(["Sample export", "Notes"], sheets.Select(s => s.Name!.Value));
        var rows = ((WorksheetPart)workbook.GetPartById(sheets[0].Id!)).Worksheet.Descendants<Row>().ToList();
        // A plain table: the header on the first row; the notes on the Notes sheet beside the table's title.
        Assert.Equal(["Reference", "Worth", "Rate", "Rank"], rows[0].Descendants<Text>().Select(t => t.Text));
        var notes = ((WorksheetPart)workbook.GetPartById(sheets[1].Id!)).Worksheet.Descendants<Row>().Select(r => r.Descendants<Text>().Select(t => t.Text).ToArray()).ToList();
        Assert.Equal([["Table", "Note"], ["Sample export", "A note"], ["Sample export", "Estimates, not advice."]], notes);
        var cells = rows[1].Elements<Cell>().ToList();
        Assert.Equal(CellValues.Number, cells[1].DataType!.Value);
        Assert.Equal(-1234.5, double.Parse(cells[1].CellValue!.Text, CultureInfo.InvariantCulture));
        Assert.Equal(2u, cells[1].StyleIndex!.Value);
        Assert.Equal(3u, cells[2].StyleIndex!.Value);
        var formats = workbook.WorkbookStylesPart!.Stylesheet.CellFormats!.Elements<CellFormat>().ToList();
        Assert.Equal(4u, formats[2].NumberFormatId!.Value);
        Assert.Equal(10u, formats[3].NumberFormatId!.Value);
    }

    [Fact]
    public async Task The_ranking_and_portfolio_exports_carry_every_measure_the_selection_and_the_cautions()
    {
        var admin = Actor.Of("export-admin", "Export Admin", Role.Administrator);
        var lead = Actor.Of("export-lead", "Export Lead", Role.ProjectLead);
        var board = Actor.Of("export-board", "Export Board", Role.Reviewer);
        var services = factory.Services;
        var marr = await services.GetRequiredService<MarrPolicyService>().AddVersionAsync(admin,
            new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Export policy"), CancellationToken.None);
        var cycle = await services.GetRequiredService<CycleService>().CreateAsync(admin,
            new NewBudgetCycle("Export cycle", 100_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), CancellationToken.None);
        var proposals = services.GetRequiredService<ProposalService>();
        foreach (var (title, cost, saving) in new[] { ("Press", 80_000.0, 16_000.0), ("Dryer", 50_000.0, 9_000.0), ("Hoist", 40_000.0, 9_000.0) })
        {
            var draft = await proposals.CreateDraftAsync(lead, new ProposalDraft(title, "", ProposalCategory.CostReduction, RiskClass.Standard,
                new ProposalAssumptions
                {
                    Model = new ModelSpec
                    {
                        Horizon = 10,
                        Elements =
                        [
                            new ElementSpec { Type = ElementKind.Single, Label = "Unit", Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
                            new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = saving },
                        ],
                    },
                }, null), CancellationToken.None);
            await proposals.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);
        }

        var ranking = await services.GetRequiredService<CycleRankingService>().RankAsync(board, cycle.Id, 0, CancellationToken.None);
        var rows = ReadCsv(CsvExport.Write(RankingExport.Table(ranking, "EUR")));
        string[] header = rows[0];
        string[] top = rows[1];
        string Field(string[] row, string name) => row[Array.IndexOf(header, name)];
        Assert.Equal("Press", Field(top, "Title"));
        // Outside reference: Microsoft.VisualBasic.Financial.PV and Pmt at 8% over ten years.
        double pw = -80_000 - Financial.PV(0.08, 10, 16_000);
        Assert.Equal(pw, double.Parse(Field(top, "Present worth (EUR)"), CultureInfo.InvariantCulture), 6);
        Assert.Equal(Financial.Pmt(0.08, 10, -pw), double.Parse(Field(top, "Annual worth per year (EUR)"), CultureInfo.InvariantCulture), 6);
        Assert.Equal("unique", Field(top, "Rate of return note"));
        Assert.Equal(64, Field(top, "Assumptions SHA-256").Length);

        var portfolio = await services.GetRequiredService<PortfolioService>().SelectAsync(board, cycle.Id, new PortfolioQuery(), CancellationToken.None);
        var table = PortfolioExport.Table(portfolio, "EUR");
        Assert.Contains(table.Notes, n => n.StartsWith("Estimates, not advice", StringComparison.Ordinal));
        Assert.Contains(table.Notes, n => n.Contains("proven optimal", StringComparison.Ordinal));
        Assert.Contains(table.Notes, n => n.StartsWith("Worth compared on one basis for unequal lives: present worth of each proposal renewed like for like", StringComparison.Ordinal));
        var exported = ReadCsv(CsvExport.Write(table));
        // Hand-checked: within 100,000 the press alone (PW 27,361) or the dryer with the hoist (10,391 + 20,391 = 30,782);
        // the greedy fill down the ranking takes the press and then nothing else fits.
        var funded = exported.Skip(1).Where(r => r[Array.IndexOf(exported[0], "Optimal selection")] == "funded").Select(r => r[2]).Order().ToList();
        Assert.Equal(["Dryer", "Hoist"], funded);
        Assert.Equal(["Press"], portfolio.Greedy.Chosen.Select(id => ranking.Rows.Single(r => r.Proposal.Reference == id).Proposal.Title));
    }
}
