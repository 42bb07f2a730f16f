namespace CapReview.Engine.Specifications;

/// <summary>A model and the rate to evaluate it at, as entered: what the quick evaluation and the API receive.</summary>
public sealed record ModelSpec
{
    public int? PeriodsPerYear { get; init; }

    public int? Horizon { get; init; }

    public RateSpec? Rate { get; init; }

    public IReadOnlyList<ElementSpec?>? Elements { get; init; }

    /// <summary>General inflation and whether the MARR is real; null when every amount is in actual money and the MARR a market rate.</summary>
    public InflationSpec? Inflation { get; init; }
}

/// <summary>General inflation as entered: its yearly rate, the base year of constant-money amounts, and the MARR's kind.</summary>
public sealed record InflationSpec
{
    /// <summary>General inflation a year, e.g. 0.02.</summary>
    public double? Rate { get; init; }

    /// <summary>The year whose money constant amounts are in (0: today's money).</summary>
    public int? BaseYear { get; init; }

    /// <summary>True when the MARR entered is a real (inflation-free) rate: the market rate is (1 + real)(1 + inflation) − 1.</summary>
    public bool? RealMarr { get; init; }
}
