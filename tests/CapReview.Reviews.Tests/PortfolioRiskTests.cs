using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class PortfolioRiskTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    private static readonly CancellationToken None = CancellationToken.None;

    [Fact]
    public async Task A_risky_proposal_is_funded_in_the_trials_where_it_beats_the_certain_one_and_the_top_changes_with_it()
    {
        // Room for one of two 120,000 chillers: the certain one saves 24,000 a year; the risky one 10,000 to 40,000.
        var cycle = await db.OpenCycleAsync("Portfolio risk 2027", 150_000m);
        var certain = await db.Proposals.CreateDraftAsync(Lead, Draft("Certain chiller"), None);
        var riskyDraft = Draft("Risky chiller", saving: 25_000);
        var risk = new RiskSpec
        {
            Seed = 31,
            Trials = 500,
            Parameters = [new ParameterSpec { Name = "Saving", Target = "elements[1].amount", Low = 10_000, MostLikely = 25_000, High = 40_000 }],
        };
        var risky = await db.Proposals.CreateDraftAsync(Lead, riskyDraft with { Assumptions = riskyDraft.Assumptions with { Risk = risk } }, None);
        await db.Proposals.SubmitAsync(Lead, certain.Id, cycle.Id, certain.Revision, None);
        await db.Proposals.SubmitAsync(Lead, risky.Id, cycle.Id, risky.Revision, None);

        var portfolio = await db.Portfolio.SelectAsync(Reviewer, cycle.Id, new PortfolioQuery(), None);
        var result = PortfolioRisk.Simulate(portfolio, 500);
        Assert.Equal([risky.Reference], result.WithRisk);

        // The same draws, replayed: the risky chiller is funded exactly when its worth beats the certain one's.
        var version = (await db.Proposals.GetAsync(Lead, risky.Id, None)).Versions.Last(v => v.IsFrozen);
        var marr = (await db.Cycles.GetAsync(cycle.Id, None)).Marr;
        var proposal = new ProposalCase(ProposalTerms.Model(version.Assumptions, marr, RiskClass.Standard));
        var (pw, aw, _) = MonteCarlo.Simulate(proposal, [new UncertainParameter("Saving", "elements[1].amount", 10_000, 25_000, 40_000)], 500, 31);
        double certainPw = portfolio.Ranking.Rows.Single(r => r.Proposal.Id == certain.Id).Ranked.PresentWorth;
        double certainAw = portfolio.Ranking.Rows.Single(r => r.Proposal.Id == certain.Id).Ranked.AnnualWorth;
        Assert.Equal(pw.Count(v => v > certainPw) / 500.0, result.Funded[risky.Reference], 12);
        Assert.Equal(1 - result.Funded[risky.Reference], result.Funded[certain.Reference], 12);
        // Base ranking: the risky one (25,000 a year) is on top; it loses the top when its saving falls below 24,000.
        Assert.Equal(aw.Count(v => v < certainAw) / 500.0, result.TopChanges, 12);
    }
}
