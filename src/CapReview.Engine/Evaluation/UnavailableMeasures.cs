namespace CapReview.Engine.Evaluation;

/// <summary>
/// Why a measure of an <see cref="Evaluation"/> is null, keyed by the measure's name as the API writes it
/// (<c>futureWorth</c>, <c>payback.discounted</c>, …): a measure that does not exist for these flows, or one whose value
/// no double can hold. Every null measure has its reason; a measure with a value has none.
/// </summary>
public static class UnavailableMeasures
{
    /// <summary>A worth past the largest double.</summary>
    public const string BeyondRange = "beyond the largest number the engine can hold (about 1.8 × 10^308)";

    public const string CapitalizedNeedsPositiveMarr = "defined only for a MARR above 0: at 0 or below, a series repeated forever has no finite worth";

    public const string ExternalRateNeedsBoth = "the flows need both payments and receipts";

    public const string NeverRecovered = "the investment is not recovered within the horizon";

    public const string NoFlows = "the model has no flows: there is nothing to recover";

    public const string DenominatorNotPositive = "the costs in its denominator are not more than zero";

    public const string FutureWorth = "futureWorth";

    public const string CapitalizedWorth = "capitalizedWorth";

    public const string ExternalRate = "externalRate";

    public const string SimplePayback = "payback.simple";

    public const string DiscountedPayback = "payback.discounted";

    public const string ConventionalRatio = "benefitCostRatio.conventional";

    public const string ModifiedRatio = "benefitCostRatio.modified";
}
