using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Records;
using UglyToad.PdfPig.DocumentLayoutAnalysis.TextExtractor;
using static CapReview.Packets.Tests.PacketDatabase;
using PigDocument = UglyToad.PdfPig.PdfDocument;

namespace CapReview.Packets.Tests;

/// <summary>A decision recorded against the board's own rules is in the cycle packet with the rule it broke and the reason given.</summary>
public sealed class OverridePacketTests(PacketDatabase db) : IClassFixture<PacketDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private async Task<ProposalView> SubmittedAsync(int cycleId, string title, double cost)
    {
        var service = db.Get<ProposalService>();
        var draft = await service.CreateDraftAsync(Lead, new ProposalDraft(title, "", ProposalCategory.CostReduction, RiskClass.Standard,
            new ProposalAssumptions
            {
                Model = new ModelSpec
                {
                    Horizon = 10,
                    Elements =
                    [
                        new ElementSpec { Type = ElementKind.Single, Label = "Purchase", Category = CashFlowCategory.Capital, Period = 0, Amount = -cost },
                        new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = cost / 4 },
                    ],
                },
            }, null), None);
        return await service.SubmitAsync(Lead, draft.Id, cycleId, draft.Revision, None);
    }

    [Fact]
    public async Task The_cycle_packet_records_an_override_and_its_reason_and_only_the_decision_that_stands()
    {
        var marr = await db.Get<MarrPolicyService>().AddVersionAsync(Admin, new NewMarrPolicy(0.08, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Override policy"), None);
        var cycle = await db.Get<CycleService>().CreateAsync(Admin, new NewBudgetCycle("Override 2027", 100_000m, marr.Id, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)), None);
        var mixer = await SubmittedAsync(cycle.Id, "Mixer", 80_000);
        var hoist = await SubmittedAsync(cycle.Id, "Hoist", 60_000);
        var decisions = db.Get<DecisionService>();
        await decisions.DecideAsync(Board, new DecisionRequest(mixer.Id, DecisionOutcome.Reject, "", cycle.Id, 1, null), None);
        await decisions.DecideAsync(Board, new DecisionRequest(hoist.Id, DecisionOutcome.Approve, "", cycle.Id, 1, null), None);
        // The mixer's rejection changed to an approval: 80,000 + 60,000 against the limit of 100,000.
        await decisions.DecideAsync(SecondBoard, new DecisionRequest(mixer.Id, DecisionOutcome.Approve, "", cycle.Id, 1, null, true, "The mixer's gearbox is beyond repair"), None);
        await decisions.SignOffAsync(Board, cycle.Id, None);
        await decisions.SignOffAsync(SecondBoard, cycle.Id, None);

        var made = await db.Get<PacketService>().PublishCycleAsync(Board, cycle.Id, None);
        Assert.Equal(3, made.Count);
        byte[] bytes = (await db.Get<PacketArchive>().DownloadAsync(Finance, made.Single(p => p.Kind == PacketKind.Cycle).Id, None)).Content;
        using PigDocument pdf = PigDocument.Open(bytes);
        string text = string.Join("\n", pdf.GetPages().Take(3).Select(p => ContentOrderTextExtractor.GetText(p)));
        static string Packed(string s) => string.Concat(s.Where(c => !char.IsWhiteSpace(c)));
        Assert.Contains(Packed($"Override: {mixer.Reference}"), Packed(text), StringComparison.Ordinal);
        Assert.Contains(Packed("The mixer's gearbox is beyond repair"), Packed(text), StringComparison.Ordinal);
        Assert.Contains(Packed("140,000 approved against a limit of 100,000"), Packed(text), StringComparison.Ordinal);
        Assert.DoesNotContain(Packed($"Override: {hoist.Reference}"), Packed(text), StringComparison.Ordinal);
        Assert.DoesNotContain("Rejected", text, StringComparison.Ordinal);
    }
}
