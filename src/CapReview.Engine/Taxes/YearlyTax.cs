namespace CapReview.Engine.Taxes;

/// <summary>
/// The tax of each year in turn, from its ordinary taxable income and its income at the gain rate, with the project's
/// losses carried forward when the settings say so (common practice, no source; see docs/methods.md). Carried losses
/// offset the whole of a later year's taxable income, the disposal's gain included, so a project whose taxable income
/// over its life sums to zero pays no tax on it and leaves no loss unused.
/// </summary>
internal sealed class YearlyTax(double rate, double gainRate, LossTreatment losses)
{
    /// <summary>Losses not yet used.</summary>
    public double Carried { get; private set; }

    /// <summary>The tax of the next year and the carried losses it used.</summary>
    /// <param name="ordinary">Taxable income at the income-tax rate (negative: a loss).</param>
    /// <param name="atGainRate">Income at the gain rate (zero or more).</param>
    public (double Tax, double LossUsed) Charge(double ordinary, double atGainRate)
    {
        if (losses == LossTreatment.Offset)
        {
            return (rate * ordinary + gainRate * atGainRate, 0);
        }
        double net = ordinary + atGainRate;
        if (net < 0)
        {
            Carried -= net;
            return (0, 0);
        }
        // The year's own loss nets against its gain before any carried loss is touched.
        if (ordinary < 0)
        {
            (ordinary, atGainRate) = (0, net);
        }
        // Carried losses come off ordinary income first: the lower gain rate applies only to the part of taxable income
        // that is gain (IRC §1(h), the smaller of the net capital gain and taxable income; from memory).
        double fromOrdinary = Math.Min(Carried, ordinary);
        double fromGain = Math.Min(Carried - fromOrdinary, atGainRate);
        Carried -= fromOrdinary + fromGain;
        return (rate * (ordinary - fromOrdinary) + gainRate * (atGainRate - fromGain), fromOrdinary + fromGain);
    }
}
