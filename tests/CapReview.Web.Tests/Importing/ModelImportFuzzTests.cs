using System.Globalization;
using System.Text;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Web.Exports;
using CapReview.Web.Importing;
using CsCheck;

namespace CapReview.Web.Tests.Importing;

/// <summary>
/// Generated files for the element import: valid sheets with cells, rows and bytes changed at random, and noise. The
/// import never throws; it either lists problems (each naming a row or column and a reason) or gives a model the
/// engine accepts. It stores nothing: the editor applies a preview only when the lead confirms it.
/// </summary>
public sealed class ModelImportFuzzTests
{
    private static readonly CultureInfo English = CultureInfo.GetCultureInfo("en-GB");
    private static readonly CultureInfo German = CultureInfo.GetCultureInfo("de-DE");

    private const string PerElement = """
        type,label,category,amount,period,first,last,every,step,growth,money,escalation
        single,Press,capital,-120000,0,,,,,,,
        uniform,Energy saved,operating,18000,,1,10,,,,,
        arithmetic,Upkeep,operating,-2000,,1,10,,-150,,,
        geometric,Scrap sales,revenue,5000,,1,10,,,3%,,
        recurring,Die refit,capital,-9000,,3,9,3,,,,
        single,Resale,salvage,15000,10,,,,,,constant,0.01
        """;

    private const string PerPeriod = """
        period,Press [capital],Energy saved [operating],Upkeep [operating]
        0,-120000,,
        1,,18000,-2000
        2,,18000,-2150
        3,,18000,-2300
        """;

    private static readonly string[] Cells =
    [
        "", " ", "0", "-0", "1e400", "-1e400", "NaN", "Infinity", "1,5", "1.5", "1.250,50", "3%", "300%", "-101%", "2147483648", "-1", "99999",
        "=1+1", "@SUM(A1)", "\"quoted, with comma\"", "\"", "single", "uniform", "geometric", "arithmetic", "recurring", "capital", "salvage",
        "revenue", "operating", "constant", "actual", "bogus", "' OR '1'='1", "<script>", "\u0000", "€", "\uFEFF", new string('9', 400),
    ];

    private static readonly Gen<(int Row, int Column, string Value)[]> CellChanges =
        Gen.Select(Gen.Int[0, 50], Gen.Int[0, 20], Gen.Frequency((4, Gen.OneOf<string>(Cells)), (1, Gen.String))).Array[0, 6];

    private static readonly Gen<(string Sheet, (int Row, int Column, string Value)[] Changes, int RowOp, int Separator, int TextOp, int Position, string Text)> CsvSamples =
        Gen.Select(Gen.OneOf<string>([PerElement, PerPeriod]), CellChanges, Gen.Int[0, 3], Gen.Int[0, 3], Gen.Frequency((5, Gen.Const(0)), (1, Gen.Int[1, 3])),
            Gen.Int[0, 10_000], Gen.String);

    [Fact]
    public void Changed_and_broken_csv_files_give_problems_or_a_valid_model_and_never_an_exception()
    {
        CsvSamples.Sample(sample =>
        {
            byte[] file = Csv(sample.Sheet, sample.Changes, sample.RowOp, sample.Separator, sample.TextOp, sample.Position, sample.Text);
            foreach (CultureInfo numbers in new[] { English, German })
            {
                AssertPreviewIsSound(ModelImport.Read("model.csv", file, numbers));
            }
        }, iter: 2000, threads: 1);
    }

    [Fact]
    public void Changed_and_broken_xlsx_files_give_problems_or_a_valid_model_and_never_an_exception()
    {
        var columns = new ExportColumn[]
        {
            new("Type", ExportKind.Text), new("Label", ExportKind.Text), new("Category", ExportKind.Text), new("Amount", ExportKind.Money),
            new("Period", ExportKind.Whole), new("First", ExportKind.Whole), new("Last", ExportKind.Whole), new("Growth", ExportKind.Percent),
        };
        var values = Gen.Frequency((3, Gen.OneOf<string>(Cells).Select(s => (object?)s)), (1, Gen.Double.Select(d => (object?)d)), (1, Gen.Const((object?)null)),
            (1, Gen.Int[-5, 2000].Select(i => (object?)i)));
        var samples = Gen.Select(Gen.Select(Gen.Int[0, 1], Gen.Int[0, 7], values).Array[0, 5], Gen.Select(Gen.Int[0, 1_000_000], Gen.Byte).Array[0, 4], Gen.Int[0, 1_000_000],
            Gen.Bool);
        samples.Sample(sample =>
        {
            object?[][] rows = [["Single", "Chiller", "Capital", -80000.25, 0, null, null, null], ["Geometric", "Power saved", "Operating", 9000.0, null, 1, 12, 0.025]];
            foreach (var (row, column, value) in sample.Item1)
            {
                // A workbook cannot hold what XML cannot: no infinities, no control characters.
                rows[row][column] = value switch
                {
                    double d when !double.IsFinite(d) => 0.0,
                    string s => new string([.. s.Where(ch => !char.IsControl(ch) && !char.IsSurrogate(ch))]),
                    _ => value,
                };
            }
            byte[] file = XlsxExport.Write(new ExportTable("Elements", [], columns, rows));
            foreach (var (position, value) in sample.Item2)
            {
                file[position % file.Length] = value;
            }
            if (sample.Item4)
            {
                file = file[..(sample.Item3 % file.Length)];
            }
            AssertPreviewIsSound(ModelImport.Read("model.xlsx", file, English));
        }, iter: 300, threads: 1);
    }

    [Fact]
    public void Noise_of_any_kind_gives_problems_and_never_an_exception()
    {
        Gen.Select(Gen.Byte.Array[0, 4000], Gen.OneOf<string>(["model.csv", "model.xlsx", "model.txt", "model"])).Sample((bytes, name) =>
        {
            ImportPreview preview = ModelImport.Read(name, bytes, English);
            AssertPreviewIsSound(preview);
        }, iter: 1000, threads: 1);
    }

    [Fact]
    public void A_workbook_with_an_external_entity_is_refused_without_reading_the_entitys_file()
    {
        // XML external entities (XXE): the sheet's XML names a file on the server; the import must not read it.
        string secret = Path.Combine(Directory.CreateTempSubdirectory("capreview-xxe-").FullName, "secret.txt");
        File.WriteAllText(secret, "server-secret-7731");
        var table = new ExportTable("Elements", [], [new("Type", ExportKind.Text), new("Label", ExportKind.Text), new("Category", ExportKind.Text),
            new("Amount", ExportKind.Money), new("Period", ExportKind.Whole)], [["Single", "PLACEHOLDER", "Capital", -5000.0, 0]]);
        using var buffer = new MemoryStream();
        buffer.Write(XlsxExport.Write(table));
        using (var zip = new System.IO.Compression.ZipArchive(buffer, System.IO.Compression.ZipArchiveMode.Update, leaveOpen: true))
        {
            foreach (var entry in zip.Entries.Where(e => e.FullName.StartsWith("xl/", StringComparison.Ordinal) && e.FullName.EndsWith(".xml", StringComparison.Ordinal)).ToList())
            {
                string xml;
                using (var reader = new StreamReader(entry.Open()))
                {
                    xml = reader.ReadToEnd();
                }
                if (!xml.Contains("PLACEHOLDER", StringComparison.Ordinal))
                {
                    continue;
                }
                int declaration = xml.StartsWith("<?xml", StringComparison.Ordinal) ? xml.IndexOf("?>", StringComparison.Ordinal) + 2 : 0;
                string root = xml[declaration..].TrimStart()[1..].Split(' ', '>')[0];
                xml = xml[..declaration] + $"<!DOCTYPE {root} [<!ENTITY xxe SYSTEM \"file://{secret}\">]>" + xml[declaration..].Replace("PLACEHOLDER", "&xxe;", StringComparison.Ordinal);
                entry.Delete();
                using var writer = new StreamWriter(zip.CreateEntry(entry.FullName).Open());
                writer.Write(xml);
            }
        }
        ImportPreview preview = ModelImport.Read("model.xlsx", buffer.ToArray(), English);
        Assert.False(preview.CanApply);
        Assert.DoesNotContain("server-secret-7731", string.Join(" ", preview.Problems.Select(p => p.Reason)) + string.Join(" ", preview.Elements.Select(e => e.Spec.Label)), StringComparison.Ordinal);
        Assert.Contains("not a readable XLSX", Assert.Single(preview.Problems).Reason, StringComparison.Ordinal);
    }

    private static void AssertPreviewIsSound(ImportPreview preview)
    {
        if (!preview.CanApply)
        {
            Assert.NotEmpty(preview.Problems);
            Assert.All(preview.Problems, p => Assert.False(string.IsNullOrWhiteSpace(p.Reason)));
            return;
        }
        var read = SpecificationReader.Read(new ModelSpec
        {
            Horizon = preview.Horizon,
            Rate = new RateSpec { Value = 0.1, Basis = RateBasis.Effective },
            // The proposal's general inflation lives outside the sheet; constant-money rows without their own escalation lean on it.
            Inflation = new InflationSpec { Rate = 0.02 },
            Elements = [.. preview.Elements.Select(e => e.Spec)],
        });
        Assert.True(read.IsValid, "The import accepted a model the engine refuses: " + string.Join("; ", read.Errors));
    }

    private static byte[] Csv(string sheet, (int Row, int Column, string Value)[] changes, int rowOp, int separator, int textOp, int position, string text)
    {
        List<string[]> rows = [.. sheet.Split('\n').Select(line => line.Split(','))];
        foreach (var (row, column, value) in changes)
        {
            string[] cells = rows[row % rows.Count];
            cells[column % cells.Length] = value;
        }
        int at = position % rows.Count;
        switch (rowOp)
        {
            case 1:
                rows.RemoveAt(at);
                break;
            case 2:
                rows.Insert(at, rows[at]);
                break;
            case 3:
                rows[at] = [.. rows[at], "extra"];
                break;
        }
        string joined = string.Join("\n", rows.Select(cells => string.Join(new[] { ",", ";", "\t", "|" }[separator], cells)));
        joined = textOp switch
        {
            1 => joined[..(position % (joined.Length + 1))],
            2 => joined.Insert(position % (joined.Length + 1), text),
            3 => "\uFEFF" + joined,
            _ => joined,
        };
        return textOp == 3 && position % 2 == 0 ? Encoding.Unicode.GetBytes(joined) : Encoding.UTF8.GetBytes(joined);
    }
}
