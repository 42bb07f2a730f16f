namespace CapReview.Reviews.Portfolio;

/// <summary>What the funded portfolio maximises.</summary>
public enum SelectionObjective
{
    /// <summary>Total present worth on the cycle's basis.</summary>
    PresentWorth,

    /// <summary>Total annual worth on the cycle's basis.</summary>
    AnnualWorth,
}
