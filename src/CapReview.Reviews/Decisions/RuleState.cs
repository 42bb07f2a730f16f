namespace CapReview.Reviews.Decisions;

/// <summary>Where one of the board's portfolio rules stands against the decisions recorded so far.</summary>
public enum RuleState
{
    /// <summary>The decisions so far keep the rule.</summary>
    Met,

    /// <summary>Not yet settled: it depends on a proposal still to be decided.</summary>
    Open,

    /// <summary>The decisions so far break the rule.</summary>
    Broken,
}
