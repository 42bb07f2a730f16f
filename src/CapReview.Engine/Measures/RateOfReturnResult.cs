namespace CapReview.Engine.Measures;

/// <summary>
/// Every rate of return of a cash-flow sequence in the searched range, with the evidence about how many there can be.
/// </summary>
/// <param name="Roots">Every root of PW(i) = 0 found, ascending, as effective rates per period.</param>
/// <param name="SignChanges">Sign changes in the net flows: by Descartes' rule of signs an upper bound on the number of roots above −100%.</param>
/// <param name="CumulativeSignChanges">Sign changes in the cumulative net flows: an upper bound on the number of positive roots (Pratt and Hammond, 1979).</param>
/// <param name="CumulativeTestPassed">True when the cumulative flows start negative, change sign exactly once and end non-zero, so there is exactly one positive root (Norström, 1972).</param>
public sealed record RateOfReturnResult(
    IReadOnlyList<double> Roots,
    int SignChanges,
    int CumulativeSignChanges,
    bool CumulativeTestPassed)
{
    public RateOfReturnKind Kind => Roots.Count switch
    {
        0 => RateOfReturnKind.None,
        1 => RateOfReturnKind.Unique,
        _ => RateOfReturnKind.Several,
    };

    /// <summary>The rate when there is exactly one, else null: never a misleading single number.</summary>
    public double? UniqueRoot => Roots.Count == 1 ? Roots[0] : null;
}
