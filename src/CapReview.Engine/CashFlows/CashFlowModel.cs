using CapReview.Engine.Factors;
using CapReview.Engine.Validation;

namespace CapReview.Engine.CashFlows;

/// <summary>
/// A proposal's cash flows: elements over periods 0 … <see cref="Horizon"/>, each period 1/<see cref="PeriodsPerYear"/>
/// of a year. Build one through <see cref="Create"/>, which names every problem instead of throwing.
/// </summary>
public sealed class CashFlowModel
{
    /// <summary>Most elements in one model.</summary>
    public const int MaxElements = 500;

    private CashFlowModel(int horizon, int periodsPerYear, IReadOnlyList<CashFlowElement> elements, double[] netFlows)
    {
        Horizon = horizon;
        PeriodsPerYear = periodsPerYear;
        Elements = elements;
        NetFlows = netFlows;
    }

    /// <summary>The last period, n.</summary>
    public int Horizon { get; }

    /// <summary>Payment periods per year: 1 annual, 2 semi-annual, 4 quarterly, 12 monthly.</summary>
    public int PeriodsPerYear { get; }

    public IReadOnlyList<CashFlowElement> Elements { get; }

    /// <summary>The net flow of each period 0 … n, the sum of every element's flow there.</summary>
    public IReadOnlyList<double> NetFlows { get; }

    /// <summary>The study horizon in years.</summary>
    public double Years => (double)Horizon / PeriodsPerYear;

    /// <summary>Validates the parts and expands the elements; every problem is named with its field path.</summary>
    public static Outcome<CashFlowModel> Create(int horizon, int periodsPerYear, IReadOnlyList<CashFlowElement> elements)
    {
        ArgumentNullException.ThrowIfNull(elements);
        var errors = new List<InputError>();
        if (horizon < 1 || horizon > CompoundInterest.MaxPeriods)
        {
            errors.Add(new("horizon", $"The horizon must be between 1 and {CompoundInterest.MaxPeriods} periods."));
        }
        if (periodsPerYear < 1 || periodsPerYear > 365)
        {
            errors.Add(new("periodsPerYear", "Periods per year must be between 1 and 365."));
        }
        if (elements.Count == 0)
        {
            errors.Add(new("elements", "Add at least one cash-flow element."));
        }
        else if (elements.Count > MaxElements)
        {
            errors.Add(new("elements", $"A model holds at most {MaxElements} elements."));
        }
        if (errors.Count > 0)
        {
            return Outcome.Failure<CashFlowModel>(errors);
        }

        for (int e = 0; e < elements.Count; e++)
        {
            string path = $"elements[{e}]";
            if (elements[e] is null)
            {
                errors.Add(new(path, "The element is missing."));
                continue;
            }
            errors.AddRange(elements[e].Check(path, horizon));
        }
        if (errors.Count > 0)
        {
            return Outcome.Failure<CashFlowModel>(errors);
        }

        var netFlows = new double[horizon + 1];
        var own = new double[horizon + 1];
        for (int e = 0; e < elements.Count; e++)
        {
            Array.Clear(own);
            elements[e].AddTo(own);
            int overflow = Array.FindIndex(own, f => !(Math.Abs(f) <= CashFlowElement.MaxFlow));
            if (overflow >= 0)
            {
                errors.Add(new($"elements[{e}].{elements[e].GrowthField}",
                    $"Grows past ±10¹⁵ by period {overflow}: shorten the series or lower its {elements[e].GrowthField}."));
                continue;
            }
            for (int t = 0; t <= horizon; t++)
            {
                netFlows[t] += own[t];
            }
        }
        if (errors.Count > 0)
        {
            return Outcome.Failure<CashFlowModel>(errors);
        }
        return Outcome.Success(new CashFlowModel(horizon, periodsPerYear, [.. elements], netFlows));
    }

    /// <summary>
    /// A model of flows the engine computed (after-tax and equity flows, one single amount a period), not entered:
    /// they are not held to the entered amounts' limit of 10^12, which a sum of several entered elements after tax may
    /// pass, only to being finite.
    /// </summary>
    internal static CashFlowModel OfComputedFlows(int horizon, int periodsPerYear, IReadOnlyList<SingleAmount> elements)
    {
        var netFlows = new double[horizon + 1];
        foreach (SingleAmount element in elements)
        {
            if (!double.IsFinite(element.Amount) || element.Period < 0 || element.Period > horizon)
            {
                throw new ArgumentOutOfRangeException(nameof(elements), element.Amount, "A computed flow must be finite and inside the horizon.");
            }
            element.AddTo(netFlows);
        }
        return new CashFlowModel(horizon, periodsPerYear, [.. elements], netFlows);
    }

    /// <summary>The flows of one element per period 0 … n (for per-element tables).</summary>
    public double[] FlowsOf(int elementIndex)
    {
        var flows = new double[Horizon + 1];
        Elements[elementIndex].AddTo(flows);
        return flows;
    }

    /// <summary>Present worth at an effective rate per period, summed from the elements' closed forms.</summary>
    public double ClosedFormPresentWorth(double ratePerPeriod)
    {
        double sum = 0.0;
        foreach (CashFlowElement element in Elements)
        {
            sum += element.PresentWorth(ratePerPeriod);
        }
        return sum;
    }

    /// <summary>Present worth of the elements of one category, from their closed forms.</summary>
    public double ClosedFormPresentWorth(double ratePerPeriod, CashFlowCategory category)
    {
        double sum = 0.0;
        foreach (CashFlowElement element in Elements)
        {
            if (element.Category == category)
            {
                sum += element.PresentWorth(ratePerPeriod);
            }
        }
        return sum;
    }
}
