using CapReview.Reviews.Proposals;

namespace CapReview.Web.Components.Ranking;

/// <summary>A proposal category as people write it.</summary>
public static class CategoryNames
{
    public static string Of(ProposalCategory category) => Reviews.Display.EnumWording.Of(category);
}
