using CapReview.Engine.Specifications;

namespace CapReview.Web.Api;

/// <summary>The optional <c>tax</c> block beside a model, in the form of a proposal version's assumptions.</summary>
public sealed record TaxBlock
{
    public TaxSpec? Tax { get; init; }
}
