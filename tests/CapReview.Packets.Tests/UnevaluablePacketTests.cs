using CapReview.Engine.Specifications;
using CapReview.Packets.Content;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor;
using PigDocument = UglyToad.PdfPig.PdfDocument;

namespace CapReview.Packets.Tests;

/// <summary>
/// A decided proposal whose MARR was stored before the −40% bound: its packet says why it states no measure, and the
/// cycle packet lists it as not ranked with the reason while ranking and selecting the others.
/// </summary>
public sealed class UnevaluablePacketTests
{
    private static string Text(byte[] pdf)
    {
        using var document = PigDocument.Open(pdf);
        return string.Join("\n", document.GetPages().Select(p => ContentOrderTextExtractor.GetText(p)));
    }

    private static (ProposalView Proposal, Reviews.Decisions.Decision Decision) StoredBeforeTheBound()
    {
        var (proposal, decision) = PacketSamples.Decided(3);
        var version = proposal.Versions[^1];
        var old = version with { Assumptions = version.Assumptions with { MarrOverride = new MarrOverride(new RateSpec { Value = -0.9999999 }, "Stored long ago") } };
        return (proposal with { Versions = [proposal.Versions[0], old] }, decision);
    }

    [Fact]
    public void The_version_packet_says_why_it_states_no_measure()
    {
        var (proposal, decision) = StoredBeforeTheBound();
        var data = new ProposalPacketData(PacketSamples.Organisation, PacketSamples.Cycle, PacketSamples.Marr, proposal, decision,
            PacketSamples.Figures(proposal, decision), PacketSamples.SignOffs, PacketSamples.Now, new SigningNotice("", "", true), Layout.PaperSize.A4);
        string text = Text(PacketRenderer.Proposal(data, PacketSamples.Certificate)).Replace("\n", " ", StringComparison.Ordinal);
        Assert.Contains("No measure of this version can be stated: MARR: The rate must be at least −40% a year", text, StringComparison.Ordinal);
    }

    [Fact]
    public void The_cycle_packet_lists_it_as_not_ranked_and_ranks_the_others()
    {
        var good = PacketSamples.Decided(1);
        var bad = StoredBeforeTheBound();
        var inputs = new CycleRankingInputs(PacketSamples.Cycle, PacketSamples.Marr, [good.Proposal, bad.Proposal], new PortfolioRules([], []));
        PortfolioResult selection = PortfolioService.Select(inputs, new PortfolioQuery(), CancellationToken.None);
        var decided = new[] { good, bad };
        var data = new CyclePacketData(PacketSamples.Organisation, PacketSamples.Cycle, PacketSamples.Marr, PacketSamples.SignOffs, decided,
            decided.ToDictionary(d => d.Proposal.Id, d => PacketSamples.Figures(d.Proposal, d.Decision)), selection, PacketSamples.Now, new SigningNotice("", "", true));
        string text = Text(PacketRenderer.Cycle(data, PacketSamples.Certificate)).Replace("\n", " ", StringComparison.Ordinal);
        Assert.Contains("Not in the ranking or the selection", text, StringComparison.Ordinal);
        Assert.Contains("P-0003", text, StringComparison.Ordinal);
        Assert.Contains("the model cannot be evaluated: rate.value", text, StringComparison.Ordinal);
        Assert.Equal(["P-0001"], selection.Optimal.Chosen);
    }
}
