using CapReview.Engine.Comparison;
using CapReview.Engine.Specifications;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Everything a version of a proposal assumes: the cash-flow model (its horizon is the life), its value at the end of
/// the cycle's study period, the estimates of the asset it replaces, and the MARR: the cycle's policy unless a
/// documented override is given. Tax, inflation and uncertainty settings join here in later issues.
/// </summary>
public sealed record ProposalAssumptions
{
    public required ModelSpec Model { get; init; }

    /// <summary>
    /// Where the board ranks over a study period that does not fit a whole number of lives: the market value at its end
    /// (shorter than the life) or the stated value of the renewal then in service (longer); null when not estimated.
    /// </summary>
    public double? ValueAtStudyEnd { get; init; }

    /// <summary>For a replacement: the asset in service and the new one year by year; null otherwise.</summary>
    public ReplacementEstimates? Replacement { get; init; }

    /// <summary>A MARR that replaces the policy's for this proposal, with the reason; null to use the policy.</summary>
    public MarrOverride? MarrOverride { get; init; }

    /// <summary>The after-tax settings (tax rates, depreciation, credits, losses, financing); null for a before-tax proposal.</summary>
    public TaxSpec? Tax { get; init; }

    /// <summary>The uncertain parameters and the simulation's trials and seed; null when no risk analysis was set up.</summary>
    public RiskSpec? Risk { get; init; }
}

/// <summary>A proposal's own MARR in place of the policy's, and why.</summary>
public sealed record MarrOverride(RateSpec Rate, string Reason);

/// <summary>
/// The defender (the asset in service: its market value now, then its market value and operating cost each further
/// year) and the challenger (the proposed asset, from the proposal's first cost, the same each year), for the timing of
/// the replacement.
/// </summary>
public sealed record ReplacementEstimates(double DefenderValueNow, IReadOnlyList<ServiceYear> Defender, IReadOnlyList<ServiceYear> Challenger)
{
    public const int MaxYears = 50;

    /// <summary>The first bad field by its path (e.g. replacement.defender[2].marketValue) and why, or null.</summary>
    public (string Field, string Message)? FirstError()
    {
        if (!double.IsFinite(DefenderValueNow) || DefenderValueNow < 0)
        {
            return ("replacement.defenderValueNow", "The defender's market value now must be a number, zero or more.");
        }
        foreach (var (name, years) in new[] { ("defender", Defender), ("challenger", Challenger) })
        {
            if (years is null || years.Count is < 1 or > MaxYears)
            {
                return ($"replacement.{name}", $"Give 1 to {MaxYears} years of estimates.");
            }
            for (int k = 0; k < years.Count; k++)
            {
                if (!double.IsFinite(years[k].MarketValue) || years[k].MarketValue < 0)
                {
                    return ($"replacement.{name}[{k}].marketValue", $"Year {k + 1}: the market value must be a number, zero or more.");
                }
                if (!double.IsFinite(years[k].OperatingCost))
                {
                    return ($"replacement.{name}[{k}].operatingCost", $"Year {k + 1}: the operating cost must be a number.");
                }
            }
        }
        return null;
    }
}
