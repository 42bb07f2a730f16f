namespace CapReview.Engine.Measures;

/// <summary>How many rates of return a cash-flow sequence has in the searched range.</summary>
public enum RateOfReturnKind
{
    /// <summary>No rate makes the present worth zero; no single rate describes the proposal.</summary>
    None,

    /// <summary>Exactly one rate.</summary>
    Unique,

    /// <summary>Several rates: none of them alone is a sound measure; use the external rate of return.</summary>
    Several,
}
