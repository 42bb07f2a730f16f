using CapReview.Engine.CashFlows;
using CapReview.Engine.Factors;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Risk;

/// <summary>
/// The fast path of a simulation: the proposal read and validated once; each trial replaces only the elements its
/// parameters touch (and the MARR), writes the net flows into a buffer the worker reuses, and measures them, with no
/// reading of the entered specification. Available when every parameter is an element field or the MARR and the
/// proposal is not taxed; otherwise the simulation re-evaluates each trial in full.
/// </summary>
internal sealed class CompiledTrials
{
    private readonly CashFlowElement[] _elements;
    private readonly (int Element, string Field)[] _targets;
    private readonly RateSpec _rate;
    private readonly int _horizon, _periodsPerYear;

    private CompiledTrials(CashFlowModel model, (int, string)[] targets, RateSpec rate)
    {
        _elements = [.. model.Elements];
        _targets = targets;
        _rate = rate;
        _horizon = model.Horizon;
        _periodsPerYear = model.PeriodsPerYear;
    }

    /// <summary>The compiled proposal, or null when a parameter or the proposal needs the full evaluation.</summary>
    public static CompiledTrials? TryCompile(ProposalCase proposal, IReadOnlyList<UncertainParameter> parameters)
    {
        // A real MARR meets inflation inside the specification reader: those proposals take the full path.
        if (proposal.Tax is not null || proposal.Model.Rate is not { } rate || proposal.Model.Inflation?.RealMarr == true)
        {
            return null;
        }
        var targets = new (int, string)[parameters.Count];
        for (int k = 0; k < parameters.Count; k++)
        {
            if (parameters[k].Target == "rate")
            {
                targets[k] = (-1, "rate");
                continue;
            }
            if (proposal.Resolve(parameters[k].Target) is not { } resolved || ProposalCase.ElementTarget(resolved) is not { } element)
            {
                return null;
            }
            targets[k] = element;
        }
        var read = SpecificationReader.Read(Sensitivity.MostLikely(proposal, parameters).Model);
        if (!read.IsValid || targets.Any(t => t.Item1 >= read.Value!.Model.Elements.Count))
        {
            return null;
        }
        return new CompiledTrials(read.Value!.Model, targets, rate);
    }

    /// <summary>A worker's reusable buffers.</summary>
    public sealed class Workspace(int elements, int horizon)
    {
        public CashFlowElement[] Elements { get; } = new CashFlowElement[elements];

        public double[] Flows { get; } = new double[horizon + 1];
    }

    public Workspace NewWorkspace() => new(_elements.Length, _horizon);

    /// <summary>One trial's PW, AW and unique rate of return (NaN when none, all NaN when the inputs make no valid model).</summary>
    public (double Pw, double Aw, double Ror) Run(ReadOnlySpan<double> values, Workspace space)
    {
        Array.Copy(_elements, space.Elements, _elements.Length);
        double rateValue = _rate.Value ?? double.NaN;
        for (int k = 0; k < _targets.Length; k++)
        {
            var (element, field) = _targets[k];
            if (element < 0)
            {
                rateValue = values[k];
                continue;
            }
            CashFlowElement? changed = Set(space.Elements[element], field, values[k], _periodsPerYear);
            if (changed is null || changed.FirstPeriod < 0 || changed.LastPeriod > _horizon || changed.FirstPeriod > changed.LastPeriod)
            {
                return (double.NaN, double.NaN, double.NaN);
            }
            space.Elements[element] = changed;
        }
        // The same bounds as the entered MARR, so that a drawn rate the full path would refuse is refused here too.
        if (MarrBounds.Check(rateValue, _rate.Basis ?? RateBasis.Effective, _rate.CompoundingsPerYear ?? 1, "rate").Count > 0)
        {
            return (double.NaN, double.NaN, double.NaN);
        }
        double i = AnnualRate.Create(rateValue, _rate.Basis ?? RateBasis.Effective, _rate.CompoundingsPerYear ?? 1).EffectivePerPeriod(_periodsPerYear);
        Array.Clear(space.Flows);
        foreach (CashFlowElement e in space.Elements)
        {
            e.AddTo(space.Flows);
        }
        double pw = FlowWorth.PresentWorth(space.Flows, i);
        double aw = pw * CompoundInterest.CapitalRecovery(i, _horizon) * CompoundInterest.UniformSeriesCompoundAmount(i, _periodsPerYear);
        if (!double.IsFinite(pw) || !double.IsFinite(aw))
        {
            // Past every double: the full path refuses such a trial's model too.
            return (double.NaN, double.NaN, double.NaN);
        }
        // A trial keeps only a unique rate: the scan of flows with several sign changes stops at a second root.
        double? unique = RateOfReturnSearch.FindUnique(space.Flows,
            AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.LowestAnnual, _periodsPerYear),
            AnnualRate.PeriodFromAnnualEffective(RateOfReturnSearch.HighestAnnual, _periodsPerYear));
        double ror = unique is double r ? AnnualRate.AnnualEffectiveFromPeriod(r, _periodsPerYear) : double.NaN;
        return (pw, aw, ror);
    }

    private static CashFlowElement? Set(CashFlowElement element, string field, double value, int periodsPerYear)
    {
        int whole = (int)Math.Round(value, MidpointRounding.AwayFromZero);
        if (field is "amount" && !(Math.Abs(value) <= CashFlowElement.MaxAmount))
        {
            return null;
        }
        return (element, field) switch
        {
            (SingleAmount s, "amount") => s with { Amount = value },
            (SingleAmount s, "period") => s with { Period = whole },
            (UniformSeries u, "amount") => u with { Amount = value },
            (UniformSeries u, "first") => u with { First = whole },
            (UniformSeries u, "last") => u with { Last = whole },
            (ArithmeticGradientSeries a, "amount") => a with { Amount = value },
            (ArithmeticGradientSeries a, "step") => a with { Step = value },
            (ArithmeticGradientSeries a, "first") => a with { First = whole },
            (ArithmeticGradientSeries a, "last") => a with { Last = whole },
            (GeometricGradientSeries g, "amount") => g with { Amount = value },
            (GeometricGradientSeries g, "growth") => value > -1 && value <= GeometricGradientSeries.MaxGrowth ? g with { Growth = value } : null,
            (GeometricGradientSeries g, "first") => g with { First = whole },
            (GeometricGradientSeries g, "last") => g with { Last = whole },
            (RecurringAmount r, "amount") => r with { Amount = value },
            (RecurringAmount r, "first") => r with { First = whole },
            (RecurringAmount r, "last") => r with { Last = whole },
            (EscalatedElement x, "escalation") => value > -1 && value <= 10 ? x with { PeriodEscalation = Math.Exp(Numerics.StableMath.Log1p(value) / periodsPerYear) - 1 } : null,
            (EscalatedElement x, _) => Set(x.Inner, field, value, periodsPerYear) is { } inner ? x with { Inner = inner } : null,
            _ => null,
        };
    }

}
