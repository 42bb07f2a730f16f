namespace CapReview.Engine.Risk;

/// <summary>The shape of an uncertain parameter's spread between its low and high values.</summary>
public enum DistributionKind
{
    /// <summary>Every value from low to high equally likely.</summary>
    Uniform,

    /// <summary>Low, most likely and high as the corners of a triangle.</summary>
    Triangular,

    /// <summary>The beta (PERT) distribution on low … high with its mode at the most likely value.</summary>
    Pert,

    /// <summary>
    /// Normal about the most likely value with σ = (high − low)/3.29, cut at low and high (a draw outside is drawn
    /// again): low and high are bounds. Were it not cut, and the most likely value midway, they would be its 5th and
    /// 95th percentiles.
    /// </summary>
    Normal,

    /// <summary>
    /// Lognormal with low and high its 5th and 95th percentiles (for costs, of the magnitudes). Its median is then
    /// √(low × high); the most likely value is the base of the sensitivity and scenarios but does not shape the draws.
    /// </summary>
    Lognormal,

    /// <summary>Given values with given probabilities.</summary>
    Discrete,
}

/// <summary>One value of a discrete parameter and its probability.</summary>
public sealed record DiscreteOutcome(double Value, double Probability);

/// <summary>
/// An input named as uncertain: where it is in the model (a field path such as <c>elements[2].amount</c>, <c>rate</c>,
/// <c>horizon</c>, <c>inflation.rate</c> or <c>tax.incomeTaxRate</c>), its low, most likely and high values, and how
/// it spreads for a simulation.
/// </summary>
public sealed record UncertainParameter(
    string Name,
    string Target,
    double Low,
    double MostLikely,
    double High,
    DistributionKind Distribution = DistributionKind.Triangular,
    IReadOnlyList<DiscreteOutcome>? Outcomes = null);
