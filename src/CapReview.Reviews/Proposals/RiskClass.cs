namespace CapReview.Reviews.Proposals;

/// <summary>How uncertain the proposal's estimates are; the MARR policy may add a premium per class.</summary>
public enum RiskClass
{
    Low,
    Standard,
    High,
}
