namespace CapReview.Reviews.Proposals;

/// <summary>Why the investment is proposed.</summary>
public enum ProposalCategory
{
    Replacement,
    Expansion,
    CostReduction,
    Compliance,
    Other,
}
