using CapReview.Engine.Comparison;

namespace CapReview.Web.Api;

/// <summary>An asset's equivalent annual cost and marginal cost for each number of years kept, and the years at the least annual cost.</summary>
public sealed record ServiceLifeResponse(IReadOnlyList<int> Years, IReadOnlyList<double> AnnualCosts, IReadOnlyList<double> MarginalCosts, int EconomicLifeYears, double LeastAnnualCost)
{
    public static ServiceLifeResponse From(ServiceLife life)
    {
        ArgumentNullException.ThrowIfNull(life);
        return new(life.Years, life.AnnualCosts, life.MarginalCosts, life.BestYears, life.LeastAnnualCost);
    }
}
