using System.Globalization;
using System.Text;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Web.Exports;
using CapReview.Web.Importing;

namespace CapReview.Web.Tests.Importing;

public sealed class ModelImportTests
{
    private static readonly CultureInfo English = CultureInfo.GetCultureInfo("en-GB");
    private static readonly CultureInfo German = CultureInfo.GetCultureInfo("de-DE");

    private static ImportPreview Csv(string text, CultureInfo? numbers = null) =>
        ModelImport.Read("model.csv", Encoding.UTF8.GetBytes(text), numbers ?? English);

    private static double[] NetFlows(ImportPreview preview)
    {
        var read = SpecificationReader.Read(new ModelSpec
        {
            Horizon = preview.Horizon,
            Rate = new RateSpec { Value = 0.1, Basis = RateBasis.Effective },
            Elements = [.. preview.Elements.Select(e => e.Spec)],
        });
        Assert.True(read.IsValid, string.Join("; ", read.Errors));
        return [.. read.Value!.Model.NetFlows];
    }

    private static ImportProblem Single(ImportPreview preview)
    {
        Assert.False(preview.CanApply);
        return Assert.Single(preview.Problems);
    }

    [Fact]
    public void Per_element_csv_gives_each_type_with_its_fields()
    {
        var preview = Csv("""
            type,label,category,amount,period,first,last,every,step,growth,money,escalation
            single,Press,capital,-120000,0,,,,,,,
            uniform,Energy saved,operating,18000,,1,10,,,,,
            arithmetic,Upkeep,operating,-2000,,1,10,,-150,,,
            geometric,Scrap sales,revenue,5000,,1,10,,,3%,,
            recurring,Die refit,capital,-9000,,3,9,3,,,,
            single,Resale,salvage,15000,10,,,,,,constant,0.01
            """);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(ImportShape.PerElement, preview.Shape);
        Assert.Equal(10, preview.Horizon);
        var specs = preview.Elements.Select(e => e.Spec).ToList();
        Assert.Equal([ElementKind.Single, ElementKind.Uniform, ElementKind.Arithmetic, ElementKind.Geometric, ElementKind.Recurring, ElementKind.Single], specs.Select(s => s.Type!.Value));
        Assert.Equal(-150, specs[2].Step);
        Assert.Equal(0.03, specs[3].Growth!.Value, 15);
        Assert.Equal(3, specs[4].Every);
        Assert.Equal(Engine.Inflation.MoneyBasis.Constant, specs[5].Money);
        Assert.Equal(0.01, specs[5].Escalation);
        Assert.Equal([2, 3, 4, 5, 6, 7], preview.Elements.Select(e => e.Row));
    }

    [Fact]
    public void Per_period_csv_becomes_the_fewest_elements_that_give_the_same_flows()
    {
        string text = """
            period,Press [capital],Energy saved,Upkeep,Overhaul [capital]
            0,-120000,,,
            1,,18000,-2000,
            2,,18000,-2150,
            3,,18000,-2300,-9000
            4,,18000,-2450,
            5,,17000,-2600,
            """;
        var preview = Csv(text);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(ImportShape.PerPeriod, preview.Shape);
        Assert.Equal(5, preview.Horizon);
        var specs = preview.Elements.Select(e => e.Spec).ToList();
        Assert.Equal(
            ["Press:Single:Capital", "Energy saved:Uniform:Operating", "Energy saved:Single:Operating", "Upkeep:Arithmetic:Operating", "Overhaul:Single:Capital"],
            specs.Select(s => $"{s.Label}:{s.Type}:{s.Category}"));
        Assert.Equal(-150, specs[3].Step);
        // The cells' column sums, period by period.
        Assert.Equal([-120000.0, 16000, 15850, 6700, 15550, 14400], NetFlows(preview));
    }

    [Fact]
    public void Semicolon_csv_with_comma_decimals_reads_in_the_chosen_culture()
    {
        var preview = Csv("period;Leasing\n0;-1.250,50\n1;300,25\n", German);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal([-1250.5, 300.25], NetFlows(preview));
    }

    [Fact]
    public void Our_own_xlsx_export_of_the_elements_imports_again_with_numbers_as_stored()
    {
        var table = new ExportTable("Elements", ["A note above the header"],
            [new("Type", ExportKind.Text), new("Label", ExportKind.Text), new("Category", ExportKind.Text), new("Amount", ExportKind.Money),
             new("Period", ExportKind.Whole), new("First", ExportKind.Whole), new("Last", ExportKind.Whole), new("Growth", ExportKind.Percent)],
            [["Single", "Chiller", "Capital", -80000.25, 0, null, null, null], ["Geometric", "Power saved", "Operating", 9000.0, null, 1, 12, 0.025]]);
        var preview = ModelImport.Read("elements.xlsx", XlsxExport.Write(table), German);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(-80000.25, preview.Elements[0].Spec.Amount);
        Assert.Equal(0.025, preview.Elements[1].Spec.Growth);
        Assert.Equal(12, preview.Horizon);
        // Row 1 is the header: the note is on the Notes sheet.
        Assert.Equal([2, 3], preview.Elements.Select(e => e.Row));
    }

    [Theory]
    [InlineData("type,label,amount,period\nlease,Truck,-100,0", 2, "A · type", "“lease” is not one of: single, uniform")]
    [InlineData("type,label,amount,period\nsingle,Truck,lots,0", 2, "C · amount", "“lots” is not a number")]
    [InlineData("type,label,amount,period\nsingle,Truck,,0", 2, "C · amount", "Give the amount")]
    [InlineData("type,label,amount,period\nsingle,Truck,-100,1.5", 2, "D · period", "not a whole number")]
    [InlineData("type,label,amount,period\nsingle,Truck,-100,", 2, "D · period", "Give the period")]
    [InlineData("type,label,category,amount,period\nsingle,Truck,fleet,-100,0", 2, "C · category", "“fleet” is not one of: capital")]
    [InlineData("type,label,amount,first,last,growth\ngeometric,Fuel,-100,1,5,4", 2, "F · growth", "out of range")]
    [InlineData("type,label,amount,first,last,step\nuniform,Fuel,-100,1,5,20", 2, "F · step", "A uniform element has no step")]
    [InlineData("type,label,amount,period,escalation\nsingle,Truck,-100,0,0.02", 2, "E · escalation", "Only an element in constant money escalates")]
    [InlineData("type,label,amount,period,colour\nsingle,Truck,-100,0,red", 1, "E · colour", "Not a column of the per-element shape")]
    [InlineData("type,label,category,amount,period,expensed\nsingle,Relining,capital,-100,4,maybe", 2, "F · expensed", "“maybe” is not yes or no")]
    [InlineData("type,label,category,amount,period,expensed\nsingle,Relining,capital,-100,0,yes", 2, "F · expensed", "Only a capital cost after period 0")]
    [InlineData("type,label,amount,amount\nsingle,Truck,-100,-100", 1, "D · amount", "appears twice")]
    [InlineData("type,label,period\nsingle,Truck,0", 1, "amount", "no “amount” column")]
    [InlineData("type,label,amount,first,last\nuniform,Fuel,-100,6,2", 2, "E · last", "The last period comes before the first.")]
    [InlineData("type,label,amount,period\nsingle,,-100,0", 2, "B · label", "label")]
    [InlineData("period,Fuel\n0,-100\n0,-50", 3, "A · period", "Period 0 is already on row 2")]
    [InlineData("period,Fuel\n0,-100\nx,-50", 3, "A · period", "not a number")]
    [InlineData("period,Fuel\n0,-100\n1,n/a", 3, "B · Fuel", "“n/a” is not a number")]
    [InlineData("period,Fuel [fleet]\n0,-100", 1, "B · Fuel [fleet]", "“fleet” is not one of")]
    [InlineData("period,,Fuel\n0,-100,-5", 1, "B", "no line-item name")]
    public void Each_kind_of_bad_cell_is_named_by_row_column_and_reason(string text, int row, string column, string reason)
    {
        ImportProblem problem = Single(Csv(text));
        Assert.Equal(row, problem.Row);
        Assert.Equal(column, problem.Column);
        Assert.Contains(reason, problem.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Every_bad_cell_of_a_file_is_listed_not_just_the_first()
    {
        var preview = Csv("type,label,amount,period\nsingle,A,x,0\nsingle,B,-1,y\nsingle,C,-1,0\nbogus,D,-1,0");
        Assert.Equal([(2, "C · amount"), (3, "D · period"), (5, "A · type")], preview.Problems.Select(p => (p.Row, p.Column)));
        Assert.Empty(preview.Elements);
    }

    [Fact]
    public void Files_beyond_the_limits_or_in_no_known_form_are_refused_with_a_message()
    {
        var big = ModelImport.Read("big.csv", new byte[ImportLimits.MaxBytes + 1], English);
        Assert.Contains("at most 1,024 KiB", Single(big).Reason, StringComparison.Ordinal);

        var rows = new StringBuilder("period,Fuel\n");
        for (int p = 0; p <= ImportLimits.MaxRows; p++)
        {
            rows.Append(CultureInfo.InvariantCulture, $"{p},-1\n");
        }
        Assert.Contains("more than 1,500 rows", Single(Csv(rows.ToString())).Reason, StringComparison.Ordinal);

        Assert.Contains("not a readable XLSX", Single(ModelImport.Read("model.xlsx", [.. "PK\u0003\u0004broken"u8], English)).Reason, StringComparison.Ordinal);
        Assert.Contains("No header row", Single(Csv("just,some\n1,2")).Reason, StringComparison.Ordinal);
        Assert.Contains("no amounts", Single(Csv("period,Fuel\n")).Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Notes_as_comment_lines_and_blank_lines_are_skipped()
    {
        var preview = Csv("# Exported by the finance system\n\ntype,label,amount,period\n\nsingle,Truck,-100,0\n");
        Assert.True(preview.CanApply);
        Assert.Equal(5, Assert.Single(preview.Elements).Row);
    }

    [Theory]
    [InlineData("elements.csv", 6)]
    [InlineData("periods.csv", 4)]
    public void The_templates_offered_for_download_import_cleanly(string template, int elements)
    {
        string path = Path.Combine(AppContext.BaseDirectory, "../../../../../src/CapReview.Web/wwwroot/templates", template);
        var preview = ModelImport.Read(template, File.ReadAllBytes(path), English);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(elements, preview.Elements.Count);
    }

    [Fact]
    public void A_later_capital_cost_marked_as_a_repair_imports_with_its_mark()
    {
        var preview = Csv("""
            type,label,category,amount,period,expensed
            single,Kiln,capital,-300000,0,
            single,Relining,capital,-40000,4,yes
            single,New burners,capital,-25000,5,no
            """);
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal([null, true, null], preview.Elements.Select(e => e.Spec.Expensed));
    }
}
