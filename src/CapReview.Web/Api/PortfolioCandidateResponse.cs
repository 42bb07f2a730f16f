namespace CapReview.Web.Api;

/// <summary>A candidate of the selection: its rank, worth on the objective, capital now and in later budget years, and who funds it.</summary>
public sealed record PortfolioCandidateResponse(int Rank, int ProposalId, string Reference, string Title, double Worth, double FirstCost,
    IReadOnlyList<double> LaterCapital, bool InOptimal, bool InGreedy);
