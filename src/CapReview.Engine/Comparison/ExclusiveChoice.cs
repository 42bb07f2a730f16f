using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;

namespace CapReview.Engine.Comparison;

/// <summary>One step of the incremental analysis: the challenger against the current best, on their difference.</summary>
/// <param name="Defender">The current best (or "do nothing").</param>
/// <param name="Challenger">The next alternative in order of first cost.</param>
/// <param name="ExtraFirstCost">The challenger's first cost less the defender's.</param>
/// <param name="IncrementalPresentWorth">PW of challenger − defender over the decision's horizon, at the MARR.</param>
/// <param name="IncrementalRateOfReturn">The unique rate of return of the difference, annual effective; null when none or several.</param>
/// <param name="IncrementalRootKind">How many rates of return the difference has.</param>
/// <param name="IncrementalBenefitCost">ΔB / ΔC from the categories; null when ΔC is not positive.</param>
/// <param name="ChallengerWins">Whether the extra money is worth spending.</param>
/// <param name="Reason">Why, in words.</param>
public sealed record IncrementalStep(
    string Defender,
    string Challenger,
    double ExtraFirstCost,
    double IncrementalPresentWorth,
    double? IncrementalRateOfReturn,
    RateOfReturnKind IncrementalRootKind,
    double? IncrementalBenefitCost,
    bool ChallengerWins,
    string Reason);

/// <summary>The choice among mutually exclusive alternatives, by annual worth and by the incremental analysis.</summary>
/// <param name="AnnualWorths">Each alternative's annual worth per year: over its own life (repeatability), or over the study period.</param>
/// <param name="PresentWorths">Each alternative's present worth over the common horizon: its life renewed like for like, or cut at the study period's end.</param>
/// <param name="BestByAnnualWorth">The alternative with the highest annual worth, or "do nothing".</param>
/// <param name="CommonHorizon">The least common multiple of the lives, or the study period, in periods.</param>
/// <param name="Steps">The incremental comparisons in order of first cost.</param>
/// <param name="BestByIncrementalAnalysis">What the last winning challenger is; equals <paramref name="BestByAnnualWorth"/>.</param>
/// <param name="Basis">The horizon compared over, in words a board member reads.</param>
public sealed record ExclusiveDecision(
    IReadOnlyDictionary<string, double> AnnualWorths,
    IReadOnlyDictionary<string, double> PresentWorths,
    string BestByAnnualWorth,
    int CommonHorizon,
    IReadOnlyList<IncrementalStep> Steps,
    string BestByIncrementalAnalysis,
    string Basis);

/// <summary>
/// Chooses one of a group of mutually exclusive alternatives (or none, unless the group is mandatory). By annual worth
/// under repeatability, and by the incremental analysis in order of first cost over the lives' common horizon: each
/// challenger wins when its extra investment earns more than the MARR. With a study period of T years both compare
/// each alternative's flows over T instead, cut there with its stated value (<see cref="StudyPeriodWorth.Window"/>),
/// the ranking's figures: a life cut at T is then not renewed to a common multiple it would never reach. The incremental rate of return decides when the
/// difference is a simple investment (money out first, one sign change, its one root in range); otherwise the
/// incremental present worth does: the same test whenever both apply. Common practice, no source; see docs/methods.md.
/// </summary>
public static class ExclusiveChoice
{
    public const string DoNothing = "do nothing";

    /// <param name="alternatives">The group's alternatives, each with its model.</param>
    /// <param name="marr">The group's one MARR.</param>
    /// <param name="mandatory">Whether one must be chosen ("do nothing" is then no option).</param>
    /// <param name="studyPeriodYears">The cycle's study period in whole years, or null for repeatability.</param>
    public static ExclusiveDecision Decide(IReadOnlyList<Alternative> alternatives, AnnualRate marr, bool mandatory, int? studyPeriodYears = null)
    {
        ArgumentNullException.ThrowIfNull(alternatives);
        if (alternatives.Count == 0)
        {
            throw new ArgumentException("A group needs at least one alternative.", nameof(alternatives));
        }
        int p = alternatives[0].Model.PeriodsPerYear;
        if (alternatives.Any(a => a.Model.PeriodsPerYear != p))
        {
            throw new ArgumentException("Alternatives compared together need the same period length.", nameof(alternatives));
        }
        if (studyPeriodYears is < 1 || studyPeriodYears * p > CompoundInterest.MaxPeriods)
        {
            throw new ArgumentOutOfRangeException(nameof(studyPeriodYears), studyPeriodYears, "The study period must be between 1 and 1,200 periods.");
        }
        int horizon = studyPeriodYears * p
            ?? CommonHorizon.LeastCommonMultiple(alternatives.Select(a => a.Model.Horizon))
            ?? throw new ArgumentException("The lives have no common multiple within 1,200 periods: compare over a study period instead.", nameof(alternatives));
        double i = marr.EffectivePerPeriod(p);
        var candidates = alternatives.ToDictionary(a => a.Name,
            a => studyPeriodYears is null ? Candidate.Of(a, horizon, i) : Candidate.OverStudyPeriod(a, horizon, i));

        var presentWorths = candidates.ToDictionary(c => c.Key, c => FlowWorth.PresentWorth(c.Value.Flows, i));
        var options = new EvaluationOptions(marr);
        // Per year, as the ranking states it: over the own life, or the worth over T spread over T.
        var worths = studyPeriodYears is null
            ? alternatives.ToDictionary(a => a.Name, a => ModelEvaluator.Evaluate(a.Model, options).AnnualWorth)
            : presentWorths.ToDictionary(w => w.Key,
                w => w.Value * CompoundInterest.CapitalRecovery(i, horizon) * CompoundInterest.UniformSeriesCompoundAmount(i, p));
        var best = worths.OrderByDescending(w => w.Value).First();
        string bestByWorth = !mandatory && best.Value < 0.0 ? DoNothing : best.Key;

        var ordered = alternatives.OrderBy(a => a.FirstCost).ThenBy(a => a.Name, StringComparer.Ordinal).ToList();
        var steps = new List<IncrementalStep>();
        Candidate defender = mandatory
            ? candidates[ordered[0].Name]
            : new Candidate(DoNothing, 0.0, new double[horizon + 1], 0.0, 0.0);
        foreach (Alternative next in mandatory ? ordered.Skip(1) : ordered)
        {
            Candidate challenger = candidates[next.Name];
            IncrementalStep step = Compare(defender, challenger, i, p);
            steps.Add(step);
            if (step.ChallengerWins)
            {
                defender = challenger;
            }
        }
        // Over a common horizon longer than any one life, a MARR near its lower bound can discount past every double.
        if (presentWorths.Values.Concat(worths.Values).Concat(steps.Select(s => s.IncrementalPresentWorth)).Any(w => !double.IsFinite(w)))
        {
            throw new ArgumentOutOfRangeException(nameof(marr), marr.EffectiveAnnual(),
                $"At this MARR the worths over the common horizon of {horizon} periods are {UnavailableMeasures.BeyondRange}.");
        }
        string basis = studyPeriodYears is int years
            ? $"each alternative over the cycle's study period of {years} years ({horizon} periods), a life that runs past it or ends inside it valued at its stated value at the end, as the ranking states its worth"
            : $"each alternative renewed like for like over the least common multiple of the lives ({horizon} periods)";
        return new ExclusiveDecision(worths, presentWorths, bestByWorth, horizon, steps, defender.Name, basis);
    }

    private static IncrementalStep Compare(Candidate defender, Candidate challenger, double i, int p)
    {
        double[] difference = new double[challenger.Flows.Length];
        for (int t = 0; t < difference.Length; t++)
        {
            difference[t] = challenger.Flows[t] - defender.Flows[t];
        }
        double deltaPw = FlowWorth.PresentWorth(difference, i);
        var roots = RateOfReturnSearch.Find(difference,
            AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.LowestAnnual, p),
            AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.HighestAnnual, p));
        double? deltaRate = roots.UniqueRoot is double r ? AnnualRate.AnnualEffectiveFromPeriod(r, p) : null;
        double marrAnnual = AnnualRate.AnnualEffectiveFromPeriod(i, p);
        double deltaBenefits = challenger.Benefits - defender.Benefits;
        double deltaCosts = challenger.Costs - defender.Costs;
        double? deltaRatio = deltaCosts > 0.0 && double.IsFinite(deltaBenefits / deltaCosts) ? deltaBenefits / deltaCosts : null;

        // The rate decides only for a simple investment: money out first and one sign change, so that it is the one
        // root above −100% and the worth is positive below it and negative above. Anything else: ΔPW decides.
        bool investmentFirst = difference.FirstOrDefault(f => f != 0.0) < 0.0;
        bool wins;
        string reason;
        if (deltaRate is double rate && investmentFirst && roots.SignChanges == 1)
        {
            wins = rate > marrAnnual;
            reason = wins ? "the extra investment earns more than the MARR" : "the extra investment earns less than the MARR";
        }
        else
        {
            wins = deltaPw > 0.0;
            reason = roots.Kind == RateOfReturnKind.Several
                ? "the difference has several rates of return; decided by its present worth"
                : wins ? "the difference has a positive present worth" : "the difference does not pay at the MARR";
        }
        return new IncrementalStep(defender.Name, challenger.Name, challenger.FirstCost - defender.FirstCost, deltaPw,
            deltaRate, roots.Kind, deltaRatio, wins, reason);
    }

    private sealed record Candidate(string Name, double FirstCost, double[] Flows, double Benefits, double Costs)
    {
        /// <summary>Benefits and costs as the benefit-cost ratio groups them, over the common horizon.</summary>
        public static Candidate Of(Alternative a, int horizon, double i)
        {
            double[] flows = CommonHorizon.Repeat(a.Model.NetFlows, horizon);
            var ratio = BenefitCostRatio.Compute(a.Model, i);
            // One life's worths, carried to the common horizon's present.
            double renewals = CommonHorizon.Renewals(i, a.Model.Horizon, horizon);
            double costs = ratio.CapitalCosts - ratio.Salvage + ratio.OperatingCosts;
            return new Candidate(a.Name, a.FirstCost, flows, ratio.Benefits * renewals, costs * renewals);
        }

        /// <summary>
        /// Over a study period of T periods: the flows cut at T with the stated value, the benefits those of the
        /// revenue elements within T, and the costs everything else, the value at T counted as salvage against them.
        /// </summary>
        public static Candidate OverStudyPeriod(Alternative a, int studyPeriod, double i)
        {
            double[] flows = StudyPeriodWorth.Window(a.Model, studyPeriod, a.ValueAtStudyEnd ?? 0.0);
            var revenue = new double[a.Model.Horizon + 1];
            for (int e = 0; e < a.Model.Elements.Count; e++)
            {
                if (a.Model.Elements[e].Category == CashFlowCategory.Revenue)
                {
                    a.Model.Elements[e].AddTo(revenue);
                }
            }
            int life = a.Model.Horizon;
            double[] benefitsWithin = CommonHorizon.Repeat(revenue, (studyPeriod + life - 1) / life * life)[..(studyPeriod + 1)];
            double benefits = FlowWorth.PresentWorth(benefitsWithin, i);
            return new Candidate(a.Name, a.FirstCost, flows, benefits, benefits - FlowWorth.PresentWorth(flows, i));
        }
    }
}
