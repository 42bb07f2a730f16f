namespace CapReview.Engine.Rates;

/// <summary>How an annual rate is quoted.</summary>
public enum RateBasis
{
    /// <summary>Effective annual rate: what one unit grows by in a year.</summary>
    Effective,

    /// <summary>Nominal annual rate compounded m times a year (r/m per sub-period).</summary>
    Nominal,

    /// <summary>Nominal annual rate compounded continuously.</summary>
    Continuous,
}
