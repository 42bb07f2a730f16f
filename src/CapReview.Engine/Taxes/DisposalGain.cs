namespace CapReview.Engine.Taxes;

/// <summary>
/// Proceeds at disposal over the book value, split by how they are taxed: the depreciation taken back (recapture) is
/// ordinary income, and only the part above the original basis is a gain at the gain rate (IRC §1245 recapture as
/// IRS Publication 544, "Depreciation Recapture", summarises it; from memory). A loss (proceeds below the book value)
/// is ordinary and deducted at the income-tax rate.
/// </summary>
/// <param name="Ordinary">The recaptured depreciation, or the loss (negative); taxed with the year's ordinary income.</param>
/// <param name="AtGainRate">The proceeds above the original basis (zero or more), at the gain rate where one is set.</param>
public readonly record struct DisposalGain(double Ordinary, double AtGainRate)
{
    /// <summary>The whole gain (negative: a loss).</summary>
    public double Total => Ordinary + AtGainRate;

    /// <param name="proceeds">What the asset (or assets) fetch at disposal.</param>
    /// <param name="bookValue">Their book value at disposal.</param>
    /// <param name="depreciationTaken">The depreciation deducted on them until then (basis less book value).</param>
    public static DisposalGain Of(double proceeds, double bookValue, double depreciationTaken)
    {
        double gain = proceeds - bookValue;
        if (gain <= 0)
        {
            return new(gain, 0);
        }
        // §1245: the gain is ordinary income up to the depreciation taken; beyond it the proceeds exceed the basis.
        double recapture = Math.Min(gain, Math.Max(0, depreciationTaken));
        return new(recapture, gain - recapture);
    }
}
