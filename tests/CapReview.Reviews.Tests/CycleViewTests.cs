using CapReview.Reviews.Cycles;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using Microsoft.VisualBasic;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>What the cycle's pages get from the domain: the review's rows with their measures, and the ranking's inputs read once.</summary>
public sealed class CycleViewTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    private async Task<(BudgetCycle Cycle, ProposalView Submitted, ProposalView Second)> CycleOfTwoAsync(string name)
    {
        var cycle = await db.OpenCycleAsync(name);
        var first = await db.Proposals.CreateDraftAsync(Lead, Draft("Compressor heat recovery", -120_000, saving: 24_000), None);
        var submitted = await db.Proposals.SubmitAsync(Lead, first.Id, cycle.Id, first.Revision, None);
        var second = await db.Proposals.CreateDraftAsync(Lead, Draft("Press line guard", -60_000, saving: 9_000), None);
        second = await db.Proposals.SubmitAsync(Lead, second.Id, cycle.Id, second.Revision, None);
        return (cycle, submitted, second);
    }

    [Fact]
    public async Task The_review_rows_carry_each_proposals_measures_at_the_cycles_marr_and_what_the_board_may_do()
    {
        var (cycle, submitted, _) = await CycleOfTwoAsync("Overview 2027");
        var overview = await db.Overviews.GetAsync(Reviewer, cycle.Id, None);
        var row = overview.Rows.Single(r => r.Proposal.Id == submitted.Id);
        Assert.Equal(1, row.VersionNumber);
        Assert.Equal(0.08, row.Marr.EffectiveAnnual(), 12);
        // Outside reference: Microsoft.VisualBasic.Financial.PV at the test policy's 8% over ten years.
        Assert.Equal(-120_000 - Financial.PV(0.08, 10, 24_000), row.Evaluation!.PresentWorth, 6);
        Assert.True(row.Decidable);
        Assert.True(overview.CanSignOff);
        Assert.Empty(overview.SignOffs.Current);
        Assert.False(overview.PacketsMissing);

        var asFinance = await db.Overviews.GetAsync(Finance, cycle.Id, None);
        Assert.All(asFinance.Rows, r => Assert.False(r.Decidable));
        Assert.False(asFinance.CanSignOff);
    }

    [Fact]
    public async Task The_ranking_from_inputs_carried_as_a_document_equals_the_ranking_read_afresh()
    {
        var (cycle, _, _) = await CycleOfTwoAsync("Carried 2027");
        var inputs = await db.Rankings.LoadAsync(Reviewer, cycle.Id, None);
        var carried = CycleRankingInputsDocument.Deserialize(CycleRankingInputsDocument.Serialize(inputs));
        foreach (var (shift, afterTax) in new[] { (0.0, false), (0.02, false), (-0.01, false) })
        {
            var fresh = await db.Rankings.RankAsync(Reviewer, cycle.Id, shift, None, afterTax);
            var again = CycleRankingService.Rank(carried, shift, afterTax);
            Assert.Equal(fresh.Rows.Select(r => (r.Proposal.Reference, r.Ranked.AnnualWorth, r.Ranked.PresentWorth)),
                again.Rows.Select(r => (r.Proposal.Reference, r.Ranked.AnnualWorth, r.Ranked.PresentWorth)));
            Assert.Equal(fresh.Basis, again.Basis);
        }
        // The cycle and its MARR version have private setters: every stored field comes back, not only what a constructor takes.
        Assert.Equal((cycle.Id, cycle.Name, cycle.CapitalLimit, cycle.Status, cycle.Revision, cycle.RequiredSignOffs, cycle.OpensOn, cycle.ClosesOn, cycle.MarrPolicyVersionId),
            (carried.Cycle.Id, carried.Cycle.Name, carried.Cycle.CapitalLimit, carried.Cycle.Status, carried.Cycle.Revision, carried.Cycle.RequiredSignOffs, carried.Cycle.OpensOn, carried.Cycle.ClosesOn, carried.Cycle.MarrPolicyVersionId));
        Assert.Equal((inputs.Marr.Id, inputs.Marr.Number, 0.08, inputs.Marr.Basis, inputs.Marr.HighRiskPremium, inputs.Marr.CreatedAt),
            (carried.Marr.Id, carried.Marr.Number, carried.Marr.Rate, carried.Marr.Basis, carried.Marr.HighRiskPremium, carried.Marr.CreatedAt));
        Assert.Equal(inputs.Proposals[0].Latest.AssumptionsHash, carried.Proposals[0].Latest.AssumptionsHash);
        Assert.Equal(AssumptionsDocument.Serialize(inputs.Proposals[0].Latest.Assumptions), AssumptionsDocument.Serialize(carried.Proposals[0].Latest.Assumptions));
    }
}
