using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// An element entered in constant money of a base period, turned into actual money by its price escalation: the flow
/// of period t is the inner element's times (1 + g)^(t − b), g the escalation per period, b the base period. Its
/// present worth keeps a closed form: Σ f_t (1 + g)^(t − b) (1 + i)^(−t) = (1 + g)^(−b) PW_inner(i′) with
/// (1 + i′) = (1 + i) / (1 + g).
/// </summary>
public sealed record EscalatedElement(CashFlowElement Inner, double PeriodEscalation, int BasePeriod)
    : CashFlowElement(Inner.Label, Inner.Category)
{
    public override int FirstPeriod => Inner.FirstPeriod;

    public override int LastPeriod => Inner.LastPeriod;

    internal override string GrowthField => Inner.GrowthField;

    public override void AddTo(Span<double> flows)
    {
        var own = new double[flows.Length];
        Inner.AddTo(own);
        double log = Numerics.StableMath.Log1p(PeriodEscalation);
        for (int t = 0; t < own.Length; t++)
        {
            if (own[t] != 0.0)
            {
                flows[t] += own[t] * Math.Exp((t - BasePeriod) * log);
            }
        }
    }

    public override double PresentWorth(double i)
    {
        double deflated = (1.0 + i) / (1.0 + PeriodEscalation) - 1.0;
        if (!(deflated > -1.0))
        {
            // The deflated rate rounds to −100% (a rate near it against steep escalation): no closed form there, so the
            // element's own flows are discounted.
            var own = new double[LastPeriod + 1];
            AddTo(own);
            return Measures.FlowWorth.PresentWorth(own, i);
        }
        return Math.Exp(-BasePeriod * Numerics.StableMath.Log1p(PeriodEscalation)) * Inner.PresentWorth(deflated);
    }

    protected override void CheckFields(string path, int horizon, List<InputError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        errors.AddRange(Inner.Check(path, horizon).Where(e => !e.Field.EndsWith(".label", StringComparison.Ordinal) && !e.Field.EndsWith(".category", StringComparison.Ordinal)));
        if (!double.IsFinite(PeriodEscalation) || PeriodEscalation <= -1.0 || PeriodEscalation > 10.0)
        {
            errors.Add(new($"{path}.escalation", "The escalation must be above −100% and at most 1000% a year."));
        }
    }
}
