using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Runs;

namespace CapReview.Reviews.Risk;

/// <summary>
/// The simulations people start, from a page or a token: each checked against the work budget, counted by the
/// <see cref="RunLimiter"/> while it runs, run off the caller's thread, and stopped between trials when its token is
/// cancelled (the page went away, the request was abandoned). The figures themselves come from
/// <see cref="ProposalRisk"/>, <see cref="RankingRisk"/> and <see cref="PortfolioRisk"/>.
/// </summary>
public sealed class RiskRuns(RunLimiter limiter)
{
    /// <summary>One proposal's seeded simulation (the editor's risk panel, <c>POST /api/v1/risk-analyses</c>).</summary>
    public async Task<SimulationSummary> SimulateAsync(Actor actor, RiskStudy study, IProgress<double>? progress, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(study);
        int trials = study.Settings.Trials;
        var (periods, elements) = Size(study);
        limiter.CheckWork(Work(study, trials), "risk.trials",
            string.Create(CultureInfo.InvariantCulture, $"{trials:N0} trials of {periods:N0} periods and {elements:N0} elements"));
        using RunLease lease = limiter.Enter(actor);
        return await Task.Run(() => ProposalRisk.Simulate(study, progress, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The ranking's probabilities of a loss: every ranked proposal with risk settings, its own trials, as one run.</summary>
    public async Task<IReadOnlyDictionary<string, double?>> LossProbabilitiesAsync(Actor actor, CycleRanking ranking, bool afterTax, CancellationToken cancellationToken)
    {
        var studies = RankingRisk.Studies(ranking, afterTax);
        long work = studies.Values.OfType<RiskStudy>().Sum(s => Work(s, s.Settings.Trials));
        var largest = studies.Where(s => s.Value is not null).MaxBy(s => Work(s.Value!, s.Value!.Settings.Trials));
        limiter.CheckWork(work, "risk.trials", string.Create(CultureInfo.InvariantCulture,
            $"simulating the {studies.Count(s => s.Value is not null)} proposals with risk settings, {largest.Key} with {largest.Value?.Settings.Trials:N0} trials,"));
        using RunLease lease = limiter.Enter(actor);
        return await Task.Run(() => RankingRisk.LossProbabilities(studies, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>The portfolio's simulation: <paramref name="trials"/> trials of every proposal with risk settings, each selected again.</summary>
    public async Task<PortfolioRiskResult> SimulatePortfolioAsync(Actor actor, PortfolioResult portfolio, int trials, IProgress<double>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(portfolio);
        if (trials is < 1 or > PortfolioRisk.MaxTrials)
        {
            throw new Common.RuleViolationException("trials: run 1 to 5,000 trials of the portfolio.");
        }
        var studies = PortfolioRisk.Studies(portfolio);
        long work = studies.Values.Sum(s => Work(s, trials));
        limiter.CheckWork(work, "trials", string.Create(CultureInfo.InvariantCulture, $"{trials:N0} trials of the {studies.Count} proposals with risk settings"));
        using RunLease lease = limiter.Enter(actor);
        return await Task.Run(() => PortfolioRisk.Simulate(portfolio, studies, trials, progress, cancellationToken), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Trials × periods × elements: every trial writes each element's flows into every period and measures them.</summary>
    public static long Work(RiskStudy study, int trials)
    {
        ArgumentNullException.ThrowIfNull(study);
        var (periods, elements) = Size(study);
        return (long)trials * periods * elements;
    }

    private static (long Periods, long Elements) Size(RiskStudy study) =>
        ((study.Proposal.Model.Horizon ?? 0) + 1L, Math.Max(1, study.Proposal.Model.Elements?.Count ?? 0));
}
