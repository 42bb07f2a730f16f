using CapReview.Engine.Rates;

namespace CapReview.Engine.Specifications;

/// <summary>An annual rate as entered: its value as a fraction, its basis, and m for a nominal rate.</summary>
public sealed record RateSpec
{
    public double? Value { get; init; }

    public RateBasis? Basis { get; init; }

    public int? CompoundingsPerYear { get; init; }
}
