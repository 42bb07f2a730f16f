namespace CapReview.Engine.Specifications;

/// <summary>A model and the rate to evaluate it at, as entered: what the quick evaluation and the API receive.</summary>
public sealed record ModelSpec
{
    public int? PeriodsPerYear { get; init; }

    public int? Horizon { get; init; }

    public RateSpec? Rate { get; init; }

    public IReadOnlyList<ElementSpec?>? Elements { get; init; }
}
