using CapReview.Engine.Specifications;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>
/// A proposal whose MARR was stored before the −40% bound (or that a what-if takes past what a number holds) is listed
/// as not ranked with the reason; the cycle's ranking and portfolio carry on with the others.
/// </summary>
public sealed class UnevaluableInCycleTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_MARR_stored_before_the_bound_leaves_its_proposal_out_with_the_reason_and_the_rest_ranked()
    {
        var cycle = await db.OpenCycleAsync("Stored before the bound " + Guid.NewGuid().ToString("N")[..6]);
        var chiller = await db.Proposals.CreateDraftAsync(Lead, Draft("Chiller"), None);
        var pump = await db.Proposals.CreateDraftAsync(Lead, Draft("Pump", saving: 30_000), None);
        await db.Proposals.SubmitAsync(Lead, chiller.Id, cycle.Id, chiller.Revision, None);
        await db.Proposals.SubmitAsync(Lead, pump.Id, cycle.Id, pump.Revision, None);
        CycleRankingInputs read = await db.Rankings.LoadAsync(Reviewer, cycle.Id, None);
        // The pump as a version stored before the bound would read: a MARR of its own at −99.99999% a year, which
        // no entry accepts now (ProposalService refuses it by name).
        var inputs = read with
        {
            Proposals = [.. read.Proposals.Select(p => p.Id != pump.Id ? p : p with
            {
                Versions = [.. p.Versions.Select(v => v with
                {
                    Assumptions = v.Assumptions with { MarrOverride = new MarrOverride(new RateSpec { Value = -0.9999999 }, "Stored long ago") },
                })],
            })],
        };

        CycleRanking ranking = CycleRankingService.Rank(inputs, 0, afterTax: false);
        Assert.Equal("Chiller", Assert.Single(ranking.Rows).Proposal.Title);
        UnrankedProposal unranked = Assert.Single(ranking.Unranked);
        Assert.Equal(pump.Id, unranked.Proposal.Id);
        Assert.Contains("rate.value", unranked.Reason, StringComparison.Ordinal);
        Assert.Contains("−40%", unranked.Reason, StringComparison.Ordinal);

        PortfolioResult portfolio = PortfolioService.Select(inputs, new PortfolioQuery(), None);
        Assert.Equal([chiller.Reference], portfolio.Optimal.Chosen);
        Assert.Equal(pump.Id, Assert.Single(portfolio.LeftOut).Proposal.Id);
    }
}
