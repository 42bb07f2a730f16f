using CapReview.Engine.Comparison;

namespace CapReview.Web.Api;

/// <summary>
/// A set of proposals as funded: their references, total worth and first cost, and how sure the solver is; the bound
/// no set can beat is null where there is none (the greedy fill, or no allowed set).
/// </summary>
public sealed record SelectionResponse(IReadOnlyList<string> Chosen, double TotalWorth, double TotalCost, bool Feasible, bool ProvenOptimal, double? UpperBound)
{
    public static SelectionResponse From(Selection s)
    {
        ArgumentNullException.ThrowIfNull(s);
        return new([.. s.Chosen.Order(StringComparer.Ordinal)], s.TotalWorth, s.TotalCost, s.Feasible, s.ProvenOptimal, double.IsFinite(s.UpperBound) ? s.UpperBound : null);
    }
}
