using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Risk;
using CapReview.Reviews.Runs;

namespace CapReview.Reviews.Tests.Runs;

/// <summary>The run limits: per person, per server, given back however a run ends, and the work budget.</summary>
public sealed class RunLimiterTests
{
    private static readonly Actor Ada = Actor.Of("ada", "Ada", Role.ProjectLead), Ben = Actor.Of("ben", "Ben", Role.Reviewer), Cy = Actor.Of("cy", "Cy", Role.Finance);

    [Fact]
    public void One_person_holds_at_most_their_share_and_the_next_waits_for_none()
    {
        var limiter = new RunLimiter(new RunLimitOptions { PerPerson = 2, PerServer = 10 });
        using var first = limiter.Enter(Ada);
        using var second = limiter.Enter(Ada);
        var refused = Assert.Throws<RunLimitReachedException>(() => limiter.Enter(Ada));
        Assert.Equal("You already have 2 simulations or portfolio calculations running, the most one person may run at once: wait for one to finish, or stop it, and try again.", refused.Message);
        // Another person is not held back by Ada's runs.
        using var other = limiter.Enter(Ben);
        Assert.Equal(3, limiter.Running);
        Assert.Equal(2, limiter.RunningFor(Ada));
    }

    [Fact]
    public void The_server_holds_at_most_its_limit_for_everyone_together()
    {
        var limiter = new RunLimiter(new RunLimitOptions { PerPerson = 2, PerServer = 2 });
        using var first = limiter.Enter(Ada);
        using var second = limiter.Enter(Ben);
        var refused = Assert.Throws<RunLimitReachedException>(() => limiter.Enter(Cy));
        Assert.StartsWith("The server is already running 2 simulations or portfolio calculations", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_place_is_given_back_once_however_the_run_ends()
    {
        var limiter = new RunLimiter(new RunLimitOptions { PerPerson = 1, PerServer = 1 });
        var lease = limiter.Enter(Ada);
        lease.Dispose();
        lease.Dispose();
        Assert.Equal(0, limiter.Running);
        using var again = limiter.Enter(Ada);
        Assert.Equal(1, limiter.Running);
    }

    [Fact]
    public async Task A_simulation_over_the_work_budget_is_refused_naming_risk_trials_before_it_takes_a_place()
    {
        var limiter = new RunLimiter(new RunLimitOptions { WorkBudget = 1_000_000 });
        var runs = new RiskRuns(limiter);
        var draft = ReviewsDatabase.Draft();
        var study = ProposalRisk.Prepare(new Engine.Risk.ProposalCase(draft.Assumptions.Model with { Rate = new RateSpec { Value = 0.08 } }), new RiskSpec
        {
            Trials = 50_000,
            Parameters = [new ParameterSpec { Name = "Saving", Target = "elements[1].amount", Low = 20_000, MostLikely = 24_000, High = 28_000 }],
        }).Value!;
        // 50,000 trials × 11 periods × 2 elements = 1,100,000 units (the budget's own unit, no source needed).
        Assert.Equal(1_100_000, RiskRuns.Work(study, 50_000));
        var refused = await Assert.ThrowsAsync<RuleViolationException>(() => runs.SimulateAsync(Ada, study, null, CancellationToken.None));
        Assert.Equal("Trials: 50,000 trials of 11 periods and 2 elements is 1,100,000 units of work (trials × periods × elements); one run may do at most 1,000,000. Run fewer trials.", refused.Message);
        Assert.Equal(0, limiter.Running);
        // Within the budget it runs, and gives its place back when done.
        var smaller = study with { Settings = study.Settings with { Trials = 40_000 } };
        var summary = await runs.SimulateAsync(Ada, smaller, null, CancellationToken.None);
        Assert.Equal(40_000, summary.Trials);
        Assert.Equal(0, limiter.Running);
    }

    [Fact]
    public async Task A_cancelled_simulation_gives_its_place_back()
    {
        var limiter = new RunLimiter(new RunLimitOptions());
        var runs = new RiskRuns(limiter);
        var study = ProposalRisk.Prepare(new Engine.Risk.ProposalCase(ReviewsDatabase.Draft().Assumptions.Model with { Rate = new RateSpec { Value = 0.08 } }), new RiskSpec
        {
            Parameters = [new ParameterSpec { Name = "Saving", Target = "elements[1].amount", Low = 20_000, MostLikely = 24_000, High = 28_000 }],
        }).Value!;
        using var cancelled = new CancellationTokenSource();
        await cancelled.CancelAsync();
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => runs.SimulateAsync(Ada, study, null, cancelled.Token));
        Assert.Equal(0, limiter.Running);
    }
}
