using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Engine.Validation;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Risk;

/// <summary>
/// The one place that turns a proposal's assumptions and risk settings into its risk figures: the editor's panel, the
/// ranking's probability of a loss, the portfolio's funding simulation, the packets and the API all come here.
/// <see cref="Prepare(ProposalCase, RiskSpec)"/> reads and checks once; <see cref="Analyse"/> gives the deterministic
/// analyses (tornado, spider, break-even, scenarios); <see cref="Simulate"/> runs the seeded simulation, which is the
/// slow part and so takes progress and cancellation. Stateless: pure computation, nothing stored.
/// </summary>
public static class ProposalRisk
{
    /// <summary>The most trials a single proposal's simulation runs: the engine's limit.</summary>
    public const int MaxTrials = MonteCarlo.MaxTrials;

    /// <summary>
    /// A version's study at the board's terms: the MARR of the policy for its risk class (or its documented
    /// override), the policy's inflation and, <paramref name="afterTax"/> and when the version has tax settings, after
    /// tax. Null when the version has no risk settings.
    /// </summary>
    public static Outcome<RiskStudy>? Prepare(ProposalAssumptions assumptions, MarrPolicyVersion policy, RiskClass riskClass, bool afterTax)
    {
        ArgumentNullException.ThrowIfNull(assumptions);
        ArgumentNullException.ThrowIfNull(policy);
        if (assumptions.Risk is not { } risk)
        {
            return null;
        }
        var proposal = new ProposalCase(ProposalTerms.Model(assumptions, policy, riskClass), afterTax ? ProposalTerms.Tax(assumptions, policy) : null);
        return Prepare(proposal, risk);
    }

    /// <summary>The study of a model as entered (the editor's draft, an API request); every bad field is named.</summary>
    public static Outcome<RiskStudy> Prepare(ProposalCase proposal, RiskSpec risk)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(risk);
        var evaluated = proposal.Evaluate();
        if (!evaluated.IsValid)
        {
            return Outcome.Failure<RiskStudy>([new("model", "Complete the model first: the analysis varies a valid model."), .. evaluated.Errors]);
        }
        var read = RiskSpecReader.Read(risk, proposal);
        if (!read.IsValid)
        {
            return Outcome.Failure<RiskStudy>(read.Errors);
        }
        if (read.Value!.Parameters.Count == 0)
        {
            return Outcome.Failure<RiskStudy>([new("risk.parameters", "Name at least one uncertain parameter.")]);
        }
        var range = ParameterRange.Check(proposal, read.Value.Parameters);
        if (range.Count > 0)
        {
            return Outcome.Failure<RiskStudy>(range);
        }
        return Outcome.Success(new RiskStudy(proposal, read.Value));
    }

    /// <summary>Tornado and spider on <paramref name="measure"/>, each parameter's break-even value and the scenarios.</summary>
    public static SensitivityResult Analyse(RiskStudy study, RiskMeasure measure = RiskMeasure.PresentWorth)
    {
        ArgumentNullException.ThrowIfNull(study);
        var (proposal, settings) = (study.Proposal, study.Settings);
        ProposalCase basis = Sensitivity.MostLikely(proposal, settings.Parameters);
        return new SensitivityResult(
            measure,
            basis.Measure(measure),
            Sensitivity.Tornado(proposal, settings.Parameters, measure),
            Sensitivity.Spider(proposal, settings.Parameters, measure, Sensitivity.SpiderChanges),
            [.. settings.Parameters.Select(p => new BreakEvenValue(p, BreakEven.Find(basis, p.Target, SearchFrom(p), SearchTo(p))))],
            Engine.Risk.Scenarios.Evaluate(proposal, settings.Parameters, settings.Named));
    }

    /// <summary>The seeded simulation with the study's own trials and seed.</summary>
    public static SimulationSummary Simulate(RiskStudy study, IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(study);
        RiskSettings s = study.Settings;
        return SimulationSummary.Of(MonteCarlo.Run(study.Proposal, s.Parameters, s.Trials, s.Seed, s.Correlations, progress, cancellationToken));
    }

    /// <summary>
    /// Each trial's present and annual worth (NaN where the draws make no valid model), in trial order, with the
    /// study's seed and correlations but <paramref name="trials"/> trials: for simulations that pair proposals trial by trial.
    /// </summary>
    public static (double[] PresentWorth, double[] AnnualWorth) Draw(RiskStudy study, int trials, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(study);
        RiskSettings s = study.Settings;
        var (pw, aw, _) = MonteCarlo.Simulate(study.Proposal, s.Parameters, trials, s.Seed, s.Correlations, cancellationToken: cancellationToken);
        return (pw, aw);
    }

    /// <summary>A first guess a person can change when picking an input to vary: its value now and a fifth either side; null when it has no value.</summary>
    public static (double Low, double MostLikely, double High)? FirstGuess(ProposalCase proposal, string target)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        if (string.IsNullOrEmpty(target) || proposal.ValueAt(target) is not double value)
        {
            return null;
        }
        double spread = Math.Abs(value) * 0.2;
        return (value - spread, value, value + spread);
    }

    // Break-even is looked for well beyond the range the lead gave (twice its width either side), since a proposal
    // whose break-even lies just outside the range is the one the board most needs to see.
    private static double Width(UncertainParameter p) => Math.Max(p.High - p.Low, Math.Abs(p.MostLikely) * 0.5 + 1e-9);

    private static double SearchFrom(UncertainParameter p) => p.Low - 2 * Width(p);

    private static double SearchTo(UncertainParameter p) => p.High + 2 * Width(p);
}
