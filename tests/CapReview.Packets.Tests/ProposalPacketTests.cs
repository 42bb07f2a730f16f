using System.Diagnostics;
using CapReview.Packets.Layout;
using CapReview.Reviews.Common;
using CapReview.Reviews.Marr;
using UglyToad.PdfPig;
using UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor;
using PigDocument = UglyToad.PdfPig.PdfDocument;

namespace CapReview.Packets.Tests;

public sealed class ProposalPacketTests
{
    private static readonly byte[] Packet = PacketRenderer.Proposal(PacketSamples.ProposalData(), PacketSamples.Certificate);

    private static string Text(byte[] pdf)
    {
        using PigDocument document = PigDocument.Open(pdf);
        return string.Join("\n", document.GetPages().Select(p => ContentOrderTextExtractor.GetText(p)));
    }

    [Fact]
    public void A_pert_parameter_is_named_PERT_in_the_risk_table()
    {
        var risk = new Engine.Specifications.RiskSpec
        {
            Seed = 7,
            Trials = 200,
            Parameters =
            [
                new Engine.Specifications.ParameterSpec { Name = "Labour saved", Target = "elements[1].amount", Low = 100_000, MostLikely = 137_000, High = 150_000, Distribution = Engine.Risk.DistributionKind.Pert },
            ],
        };
        string text = Text(PacketRenderer.Proposal(PacketSamples.ProposalData(risk: risk), PacketSamples.Certificate));
        Assert.Contains("PERT", text, StringComparison.Ordinal);
        Assert.DoesNotContain("Pert", text, StringComparison.Ordinal);
    }

    [Fact]
    public void The_packet_states_the_decision_the_hashes_the_sign_offs_and_the_cautions()
    {
        string text = Text(Packet);
        var data = PacketSamples.ProposalData();
        Assert.Contains("Tarnby Components Ltd", text);
        Assert.Contains("P-0002", text);
        Assert.Contains("CNC line 3 replacement", text);
        Assert.Contains("APPROVED", text);
        Assert.Contains("Order before the March price rise", text);
        Assert.Contains(data.Version.AssumptionsHash, text.Replace("\n", "", StringComparison.Ordinal));
        Assert.Contains(MarrPolicyDocument.Hash(PacketSamples.Marr), text.Replace("\n", "", StringComparison.Ordinal));
        Assert.Contains("Tove Berg", text);
        Assert.Contains("Aino Salo", text);
        Assert.Contains("Development signature", text);
        Assert.Contains(Cautions.Estimates[..60], text.Replace("\n", " ", StringComparison.Ordinal));
        Assert.Contains("Changes from version 1 to version 2", text);
    }

    [Fact]
    public void The_version_changes_read_in_words_in_the_editors_numbering_with_their_effect_on_present_worth_and_no_field_path()
    {
        string text = Text(Packet);
        string flat = text.Replace("\n", " ", StringComparison.Ordinal);
        // Version 2 raised the geometric saving (element 2, growing 2 % a year over 12 years) from 127,000 to 137,000.
        Assert.Contains("Element 2, ‘Labour and scrap saved’", flat);
        Assert.Contains("first amount", flat);
        Assert.Contains("127,000", flat);
        Assert.Contains("137,000", flat);
        // Its effect at the 9 % MARR: 10,000 × (1 − (1.02 / 1.09)¹²) / (0.09 − 0.02), the geometric-gradient
        // present-worth factor (common practice, no source).
        double effect = 10_000 * (1 - Math.Pow(1.02 / 1.09, 12)) / (0.09 - 0.02);
        Assert.Contains(new PacketFormat(PacketSamples.Organisation.Culture, "EUR").Money(effect), flat);
        Assert.Contains("every other change held", flat);
        foreach (string machine in new[] { "elements[", "model.", "risk.parameters", "CostReduction" })
        {
            Assert.DoesNotContain(machine, text, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_measures_are_the_engines_at_the_policy_marr_with_thousands_separators()
    {
        var data = PacketSamples.ProposalData();
        var evaluation = Reviews.Proposals.VersionComparison.Evaluate(data.Version.Assumptions, PacketSamples.Marr.RateFor(data.Proposal.RiskClass))!;
        var format = new PacketFormat(PacketSamples.Organisation.Culture, "EUR");
        string text = Text(Packet);
        Assert.Contains($"{format.Money(evaluation.PresentWorth)} EUR", text);
        Assert.Contains($"{format.Money(evaluation.AnnualWorth)} EUR a year", text);
        Assert.Contains(format.Percent(evaluation.RatesOfReturn.Single()) + " a year (unique)", text);
        Assert.Contains("9.00 % a year effective: policy version 1 for risk class Standard", text);
        Assert.Matches(@"\d{1,3},\d{3}", format.Money(evaluation.PresentWorth));
    }

    [Fact]
    public void A_version_with_tax_settings_carries_its_depreciation_schedule_after_tax_table_and_the_tax_caution()
    {
        var tax = new Engine.Specifications.TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new Engine.Specifications.DepreciationSpec { Method = Engine.Specifications.DepreciationMethod.Macrs, PropertyClass = Engine.Depreciation.MacrsClass.SevenYear },
        };
        var data = PacketSamples.ProposalData(tax: tax);
        string text = Text(PacketRenderer.Proposal(data, PacketSamples.Certificate));
        Assert.Contains("Depreciation schedule", text);
        Assert.Contains("After-tax cash flows", text);
        Assert.Contains("Tax and depreciation rules vary by jurisdiction and by year", text.Replace("\n", " ", StringComparison.Ordinal));
        // IRS Publication 946, Table A-1: 7-year property, half-year convention, year 1 at 14.29 %.
        Assert.Contains("14.29 %", text);
        var result = Engine.Evaluation.AfterTaxEvaluator.Evaluate(Reviews.Proposals.ProposalTerms.Model(data.Version.Assumptions, PacketSamples.Marr, data.Proposal.RiskClass), tax).Value!;
        Assert.Contains(new PacketFormat(PacketSamples.Organisation.Culture, "EUR").Money(result.AfterTax.PresentWorth), text);
        Assert.DoesNotContain("Depreciation schedule", Text(Packet));
    }

    [Fact]
    public void A_later_capital_outlay_is_listed_with_its_own_depreciation()
    {
        var tax = new Engine.Specifications.TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new Engine.Specifications.DepreciationSpec { Method = Engine.Specifications.DepreciationMethod.Macrs, PropertyClass = Engine.Depreciation.MacrsClass.SevenYear },
        };
        var f = new PacketFormat(PacketSamples.Organisation.Culture, "EUR");
        string text = Text(PacketRenderer.Proposal(PacketSamples.ProposalData(tax: tax), PacketSamples.Certificate)).Replace("\n", " ", StringComparison.Ordinal);
        Assert.Contains("Later capital outlays", text);
        // The spindle rebuild of 45,000 at year 5, 7-year property: its first year is 45,000 / 7 (200 % declining balance
        // with half a year; IRS Publication 946, Table A-1, 14.29 %).
        Assert.Contains($"5 {f.Money(45_000.0)} {f.Money(45_000 / 7.0)}", text);
        Assert.DoesNotContain("Later capital outlays", Text(Packet));
        Assert.Contains("Every outlay is depreciated by the first cost's class or life.", text);
    }

    [Fact]
    public void A_later_capital_outlay_of_its_own_class_is_named_with_it()
    {
        var tax = new Engine.Specifications.TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new Engine.Specifications.DepreciationSpec { Method = Engine.Specifications.DepreciationMethod.Macrs, PropertyClass = Engine.Depreciation.MacrsClass.SevenYear },
        };
        var data = PacketSamples.ProposalData(tax: tax, spindle: new Engine.Depreciation.OutlayClass { PropertyClass = Engine.Depreciation.MacrsClass.ThreeYear });
        var f = new PacketFormat(PacketSamples.Organisation.Culture, "EUR");
        string text = Text(PacketRenderer.Proposal(data, PacketSamples.Certificate)).Replace("\n", " ", StringComparison.Ordinal);
        Assert.Contains("Spindle rebuild: MACRS 3-year property", text);
        // The spindle rebuild of 45,000 at year 5 as 3-year property: its first year is 45,000 / 3 (200 % declining
        // balance with half a year; IRS Publication 946, Table A-1, 33.33 %).
        Assert.Contains($"5 {f.Money(45_000.0)} {f.Money(45_000 / 3.0)}", text);
    }

    [Fact]
    public void A_version_with_a_risk_analysis_carries_the_tornado_the_distribution_the_seed_and_the_trials()
    {
        var risk = new Engine.Specifications.RiskSpec
        {
            Trials = 4_000,
            Seed = 99,
            Parameters = [new Engine.Specifications.ParameterSpec { Name = "Labour saved", Target = "elements[1].amount", Low = 100_000, MostLikely = 137_000, High = 150_000 }],
        };
        var data = PacketSamples.ProposalData(risk: risk);
        string text = Text(PacketRenderer.Proposal(data, PacketSamples.Certificate));
        Assert.Contains("Sensitivity and risk", text);
        Assert.Contains("4,000 trials, seed 99", text);
        var proposal = new Engine.Risk.ProposalCase(Reviews.Proposals.ProposalTerms.Model(data.Version.Assumptions, PacketSamples.Marr, data.Proposal.RiskClass));
        var result = Engine.Risk.MonteCarlo.Run(proposal, [new("Labour saved", "elements[1].amount", 100_000, 137_000, 150_000)], 4_000, 99);
        Assert.Contains(new PacketFormat(PacketSamples.Organisation.Culture, "EUR").Percent(result.ProbabilityOfLoss) + " of the trials", text);
        using PigDocument pdf = PigDocument.Open(PacketRenderer.Proposal(data, PacketSamples.Certificate));
        Assert.True(pdf.TryGetBookmarks(out var bookmarks));
        Assert.Contains("Risk", bookmarks.Roots.Single().Children.Select(c => c.Title));
    }

    [Fact]
    public void Pages_are_numbered_bookmarked_and_sized_to_the_chosen_paper()
    {
        using PigDocument a4 = PigDocument.Open(Packet);
        int pages = a4.NumberOfPages;
        Assert.True(pages >= 4, $"{pages} pages");
        Assert.Contains($"page 1 of {pages}", ContentOrderTextExtractor.GetText(a4.GetPage(1)));
        Assert.Contains($"page {pages} of {pages}", ContentOrderTextExtractor.GetText(a4.GetPage(pages)));
        Assert.Equal(595, Math.Round(a4.GetPage(1).Width));
        Assert.Equal(842, Math.Round(a4.GetPage(1).Height));
        Assert.True(a4.TryGetBookmarks(out var bookmarks));
        Assert.Equal("P-0002 CNC line 3 replacement", bookmarks.Roots.Single().Title);
        Assert.Contains("Version history", bookmarks.Roots.Single().Children.Select(c => c.Title));

        using PigDocument letter = PigDocument.Open(PacketRenderer.Proposal(PacketSamples.ProposalData(PaperSize.Letter), PacketSamples.Certificate));
        Assert.Equal(612, Math.Round(letter.GetPage(1).Width));
        Assert.Equal(792, Math.Round(letter.GetPage(1).Height));
    }

    [Fact]
    public void The_signature_verifies_with_pdfsig_and_a_changed_byte_makes_it_fail()
    {
        string folder = Directory.CreateTempSubdirectory("capreview-pdfsig-").FullName;
        string good = Path.Combine(folder, "packet.pdf"), bad = Path.Combine(folder, "tampered.pdf");
        File.WriteAllBytes(good, Packet);
        byte[] tampered = (byte[])Packet.Clone();
        // Change one digit inside the page content, outside the signature's own bytes.
        int at = FindOutsideSignature(tampered);
        tampered[at] = (byte)(tampered[at] == (byte)'1' ? '2' : '1');
        File.WriteAllBytes(bad, tampered);

        Assert.Contains("Signature is Valid.", Pdfsig(good));
        Assert.DoesNotContain("Signature is Valid.", Pdfsig(bad));
        Assert.True(SignatureCheck.Verifies(Packet));
        Assert.False(SignatureCheck.Verifies(tampered));
    }

    private static int FindOutsideSignature(byte[] pdf)
    {
        var (start, gapStart, gapEnd) = SignatureCheck.Ranges(pdf);
        for (int k = pdf.Length / 3; k < pdf.Length; k++)
        {
            if ((k < gapStart || k >= gapEnd) && k >= start && pdf[k] is (byte)'0' or (byte)'1' or (byte)'2')
            {
                return k;
            }
        }
        throw new InvalidOperationException("No digit outside the signature.");
    }

    internal static string Pdfsig(string path)
    {
        using var process = Process.Start(new ProcessStartInfo("pdfsig", [path]) { RedirectStandardOutput = true, RedirectStandardError = true })
            ?? throw new InvalidOperationException("pdfsig (Debian poppler-utils) is not installed.");
        string output = process.StandardOutput.ReadToEnd() + process.StandardError.ReadToEnd();
        process.WaitForExit();
        return output;
    }
}

/// <summary>Writes sample packets for looking at (CAPREVIEW_PACKETS=folder); does nothing otherwise.</summary>
public sealed class SamplePacketFiles
{
    [Fact]
    public void Write_sample_packets_when_asked()
    {
        string? folder = Environment.GetEnvironmentVariable("CAPREVIEW_PACKETS");
        if (string.IsNullOrEmpty(folder))
        {
            return;
        }
        Directory.CreateDirectory(folder);
        File.WriteAllBytes(Path.Combine(folder, "proposal.pdf"), PacketRenderer.Proposal(PacketSamples.ProposalData(), PacketSamples.Certificate));
        File.WriteAllBytes(Path.Combine(folder, "cycle.pdf"), PacketRenderer.Cycle(PacketSamples.CycleData(4), PacketSamples.Certificate));
        var tax = new Engine.Specifications.TaxSpec
        {
            IncomeTaxRate = 0.25,
            Depreciation = new Engine.Specifications.DepreciationSpec { Method = Engine.Specifications.DepreciationMethod.Macrs, PropertyClass = Engine.Depreciation.MacrsClass.SevenYear },
            Loan = new Engine.Specifications.LoanSpec { Share = 0.5, Rate = 0.06, Term = 6 },
        };
        var risk = new Engine.Specifications.RiskSpec
        {
            Seed = 7,
            Parameters =
            [
                new Engine.Specifications.ParameterSpec { Name = "Labour saved", Target = "elements[1].amount", Low = 100_000, MostLikely = 137_000, High = 150_000 },
                new Engine.Specifications.ParameterSpec { Name = "MARR", Target = "rate", Low = 0.07, MostLikely = 0.09, High = 0.12, Distribution = Engine.Risk.DistributionKind.Pert },
            ],
        };
        File.WriteAllBytes(Path.Combine(folder, "after-tax.pdf"), PacketRenderer.Proposal(PacketSamples.ProposalData(tax: tax, risk: risk), PacketSamples.Certificate));
    }
}

/// <summary>A version whose most likely value is not the model's: the packet says so beside the risk figures.</summary>
public sealed class RiskDriftPacketTests
{
    private static string Text(byte[] packet)
    {
        using var pdf = UglyToad.PdfPig.PdfDocument.Open(packet);
        return string.Join("\n", pdf.GetPages().Select(p => UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor.ContentOrderTextExtractor.GetText(p))).Replace("\n", " ", StringComparison.Ordinal);
    }

    private static Engine.Specifications.RiskSpec Labour(double mostLikely) => new()
    {
        Seed = 7,
        Trials = 500,
        Parameters = [new Engine.Specifications.ParameterSpec { Name = "Labour saved", Target = "elements[1].amount", Low = 100_000, MostLikely = mostLikely, High = 150_000 }],
    };

    [Fact]
    public void A_most_likely_value_apart_from_the_model_is_named_in_the_packet_and_one_that_follows_is_not()
    {
        // The sample's second element saves 137,000 a year; a most likely value of 120,000 centres the figures elsewhere.
        string apart = Text(PacketRenderer.Proposal(PacketSamples.ProposalData(risk: Labour(120_000)), PacketSamples.Certificate));
        string following = Text(PacketRenderer.Proposal(PacketSamples.ProposalData(risk: Labour(137_000)), PacketSamples.Certificate));

        Assert.Contains("Most likely values apart from the model", apart, StringComparison.Ordinal);
        Assert.Contains("Labour saved: most likely 120,000, the model's value 137,000.", apart, StringComparison.Ordinal);
        Assert.DoesNotContain("Most likely values apart from the model", following, StringComparison.Ordinal);
    }
}

public sealed class CyclePacketTests
{
    [Fact]
    public void A_cycle_packet_of_30_proposals_renders_with_a_bookmark_for_each_and_page_numbers()
    {
        byte[] packet = PacketRenderer.Cycle(PacketSamples.CycleData(30), PacketSamples.Certificate);
        using var pdf = UglyToad.PdfPig.PdfDocument.Open(packet);
        Assert.True(pdf.NumberOfPages > 90, $"{pdf.NumberOfPages} pages");
        Assert.True(pdf.TryGetBookmarks(out var bookmarks));
        Assert.Equal(31, bookmarks.Roots.Count);
        Assert.Contains($"page {pdf.NumberOfPages} of {pdf.NumberOfPages}",
            UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor.ContentOrderTextExtractor.GetText(pdf.GetPage(pdf.NumberOfPages)));
        Assert.True(SignatureCheck.Verifies(packet));
    }

    [Fact]
    public void Making_a_packet_again_for_the_same_version_cites_the_same_assumptions_hash()
    {
        var data = PacketSamples.ProposalData();
        // Every SHA-256 the cover cites (assumptions, MARR policy), in order; a wrapped hash is joined again.
        string[] Hashes(byte[] pdf)
        {
            using var document = UglyToad.PdfPig.PdfDocument.Open(pdf);
            string text = UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor.ContentOrderTextExtractor.GetText(document.GetPage(1)).Replace("\n", "", StringComparison.Ordinal);
            return [.. System.Text.RegularExpressions.Regex.Matches(text, "[0-9a-f]{64}").Select(m => m.Value)];
        }
        string[] first = Hashes(PacketRenderer.Proposal(data, PacketSamples.Certificate));
        string[] second = Hashes(PacketRenderer.Proposal(data with { GeneratedAt = data.GeneratedAt.AddDays(1) }, PacketSamples.Certificate));
        string recomputed = Reviews.Proposals.AssumptionsDocument.Hash(Reviews.Proposals.AssumptionsDocument.Serialize(data.Version.Assumptions));
        Assert.Equal(data.Version.AssumptionsHash, recomputed);
        Assert.Contains(recomputed, first);
        Assert.Equal(first, second);
    }
}
