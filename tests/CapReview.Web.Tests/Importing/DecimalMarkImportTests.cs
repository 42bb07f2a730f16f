using System.Text;
using CapReview.Web.Importing;

namespace CapReview.Web.Tests.Importing;

/// <summary>Files whose numbers use a decimal comma, read without a hundredfold or thousandfold slip.</summary>
public sealed class DecimalMarkImportTests
{
    private static ImportPreview Csv(string text, DecimalMark? mark = null) => ModelImport.Read("model.csv", Encoding.UTF8.GetBytes(text), mark);

    [Fact]
    public void A_semicolon_file_with_decimal_commas_reads_minus_480000_50_and_shows_each_number_as_written_and_as_read()
    {
        var preview = Csv("type;label;category;amount;period;first;last\nsingle;Press;capital;-480000,50;0;;\nuniform;Energy saved;operating;61000,25;;1;8\n");
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(';', preview.Separator);
        Assert.Equal(DecimalMark.Comma, preview.Mark);
        Assert.False(preview.MarkChosen);
        Assert.Equal(-480_000.50, preview.Elements[0].Spec.Amount);
        Assert.Equal(61_000.25, preview.Elements[1].Spec.Amount);
        Assert.Contains(preview.Parsed, n => n is { Row: 2, Written: "-480000,50", Read: -480_000.50 });
        Assert.Contains(preview.Parsed, n => n is { Row: 3, Written: "61000,25", Read: 61_000.25 });
    }

    [Fact]
    public void Read_with_a_decimal_point_chosen_a_decimal_comma_number_is_refused_not_read_a_hundred_times_larger()
    {
        var preview = Csv("type;label;category;amount;period\nsingle;Press;capital;-480000,50;0\n", DecimalMark.Point);
        Assert.False(preview.CanApply);
        var problem = Assert.Single(preview.Problems);
        Assert.Equal(2, problem.Row);
        Assert.Contains("“-480000,50” is not a number written with the decimal mark “.”", problem.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Numbers_either_mark_reads_a_thousand_apart_wait_for_the_person_to_choose()
    {
        const string File = "type;label;category;amount;period\nsingle;Press;capital;-1.250;0\nsingle;Resale;salvage;300;5\n";
        var open = Csv(File);
        Assert.True(open.Detected!.Ambiguous);
        Assert.True(open.NeedsMarkChoice);
        Assert.False(open.CanApply);
        Assert.Contains("row 2: -1.250", open.Detected.Evidence, StringComparison.Ordinal);

        var comma = Csv(File, DecimalMark.Comma);
        Assert.True(comma.CanApply, string.Join("; ", comma.Problems));
        Assert.Equal(-1_250, comma.Elements[0].Spec.Amount);
        var point = Csv(File, DecimalMark.Point);
        Assert.True(point.CanApply, string.Join("; ", point.Problems));
        Assert.Equal(-1.25, point.Elements[0].Spec.Amount);
    }

    [Theory]
    [InlineData("1.234,5", DecimalMark.Comma)]
    [InlineData("1,234.5", DecimalMark.Point)]
    [InlineData("0,125", DecimalMark.Comma)]
    [InlineData("0.125", DecimalMark.Point)]
    [InlineData("1.234.567", DecimalMark.Comma)]
    [InlineData("12345,678", DecimalMark.Comma)]
    public void One_number_that_only_one_mark_reads_decides_the_file(string written, DecimalMark mark)
    {
        var grid = new SheetGrid([new SheetRow(1, [new SheetCell("amount", null)]), new SheetRow(2, [new SheetCell(written, null)])]);
        Assert.Equal(mark, DecimalMarkDetection.Detect(grid).Mark);
    }

    [Fact]
    public void A_file_mixing_both_marks_is_refused_until_one_is_chosen()
    {
        var preview = Csv("period;Lease;Energy\n0;-1250,50;\n1;;300.25\n");
        Assert.False(preview.CanApply);
        Assert.Contains(preview.Problems, p => p.Reason.Contains("mixes decimal marks (row 3: 300.25 needs a decimal point, row 2: -1250,50 a decimal comma)", StringComparison.Ordinal));
    }

    [Fact]
    public void Whole_numbers_need_no_choice()
    {
        var preview = Csv("type,label,category,amount,period\nsingle,Press,capital,-480000,0\n");
        Assert.True(preview.CanApply, string.Join("; ", preview.Problems));
        Assert.Equal(',', preview.Separator);
        Assert.Equal(-480_000, preview.Elements[0].Spec.Amount);
    }
}
