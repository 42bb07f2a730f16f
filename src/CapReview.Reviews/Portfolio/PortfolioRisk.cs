using CapReview.Engine.Comparison;
using CapReview.Reviews.Risk;

namespace CapReview.Reviews.Portfolio;

/// <summary>How often each proposal is funded when the uncertain estimates vary, and how often the ranking's top changes.</summary>
/// <param name="Trials">Trials run.</param>
/// <param name="Funded">Each proposal's share of trials in which the optimal selection funds it, by reference.</param>
/// <param name="TopChanges">The share of trials in which another proposal tops the ranking by annual worth.</param>
/// <param name="WithRisk">The proposals whose estimates varied (the others keep their figures in every trial).</param>
public sealed record PortfolioRiskResult(int Trials, IReadOnlyDictionary<string, double> Funded, double TopChanges, IReadOnlyList<string> WithRisk);

/// <summary>
/// The cycle's risk as a whole: each proposal with a risk analysis is simulated with its own parameters, correlations
/// and seed (before tax, on its life's basis; a group's alternatives carried over their chain as the selection carries
/// them), trial by trial; in each trial the proposals are ranked by annual worth
/// and the portfolio selected again under the cycle's rules. Proposals are drawn independently of each other.
/// </summary>
public static class PortfolioRisk
{
    public const int MaxTrials = 5_000;

    public static PortfolioRiskResult Simulate(PortfolioResult portfolio, int trials, IProgress<double>? progress = null, CancellationToken cancellationToken = default) =>
        Simulate(portfolio, Studies(portfolio), trials, progress, cancellationToken);

    /// <summary>The risk studies of the candidates that have risk settings, by reference (before tax, on their lives' basis).</summary>
    public static IReadOnlyDictionary<string, RiskStudy> Studies(PortfolioResult portfolio)
    {
        ArgumentNullException.ThrowIfNull(portfolio);
        var studies = new Dictionary<string, RiskStudy>(StringComparer.Ordinal);
        foreach (RankingRow row in Candidates(portfolio))
        {
            if (ProposalRisk.Prepare(row.Version.Assumptions, portfolio.Ranking.Marr, row.Proposal.RiskClass, afterTax: false) is { Value: { } study })
            {
                studies[row.Proposal.Reference] = study;
            }
        }
        return studies;
    }

    /// <summary>The simulation from studies already prepared (<see cref="Studies"/>).</summary>
    public static PortfolioRiskResult Simulate(PortfolioResult portfolio, IReadOnlyDictionary<string, RiskStudy> studies, int trials, IProgress<double>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(portfolio);
        ArgumentNullException.ThrowIfNull(studies);
        if (trials is < 1 or > MaxTrials)
        {
            throw new ArgumentOutOfRangeException(nameof(trials), trials, "Run 1 to 5,000 trials of the portfolio.");
        }
        var rows = Candidates(portfolio);
        var samples = new Dictionary<string, (double[] Pw, double[] Aw)>();
        foreach (var (reference, study) in studies)
        {
            samples[reference] = ProposalRisk.Draw(study, trials, cancellationToken);
        }
        string baseTop = rows.OrderByDescending(r => r.Ranked.AnnualWorth).Select(r => r.Proposal.Reference).FirstOrDefault() ?? "";
        var funded = rows.ToDictionary(r => r.Proposal.Reference, _ => 0);
        int topChanges = 0;
        bool annual = portfolio.Objective == SelectionObjective.AnnualWorth;
        // A trial draws one life's worth; a group's alternatives are put on their chain's horizon as the selection is.
        var renewals = SelectionWorths.Of(portfolio.Ranking, portfolio.Objective).Renewals;
        for (int t = 0; t < trials; t++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            var candidates = portfolio.Problem.Candidates.Select(c => samples.TryGetValue(c.Id, out var s)
                ? c with { Worth = annual ? Finite(s.Aw[t]) : Finite(s.Pw[t]) * renewals[c.Id] }
                : c).ToList();
            string top = rows.OrderByDescending(r => samples.TryGetValue(r.Proposal.Reference, out var s) ? Finite(s.Aw[t]) : r.Ranked.AnnualWorth)
                .Select(r => r.Proposal.Reference).First();
            if (top != baseTop)
            {
                topChanges++;
            }
            var problem = portfolio.Problem with { Candidates = candidates };
            Selection chosen = candidates.Count <= 10 ? CapitalSelection.Exhaustive(problem) : CapitalSelection.Optimal(problem, TimeSpan.FromSeconds(1), cancellationToken);
            foreach (string id in chosen.Chosen)
            {
                funded[id]++;
            }
            if (t % 50 == 0)
            {
                progress?.Report((double)t / trials);
            }
        }
        progress?.Report(1);
        return new PortfolioRiskResult(trials, funded.ToDictionary(f => f.Key, f => (double)f.Value / trials), (double)topChanges / trials, [.. samples.Keys.Order(StringComparer.Ordinal)]);
    }

    private static List<RankingRow> Candidates(PortfolioResult portfolio) =>
        [.. portfolio.Ranking.Rows.Where(r => portfolio.Problem.Candidates.Any(c => c.Id == r.Proposal.Reference))];

    // A trial whose inputs made no valid model counts as worth nothing.
    private static double Finite(double value) => double.IsFinite(value) ? value : 0;
}
