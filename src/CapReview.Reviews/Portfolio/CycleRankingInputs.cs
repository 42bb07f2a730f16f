using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Everything a cycle's ranking and portfolio are computed from, read from the database in one go: the cycle, its MARR
/// version, its proposals under review or approved, and its rules. Every what-if (another MARR, after tax, another
/// limit or objective) is computed from the same inputs without reading again.
/// </summary>
public sealed record CycleRankingInputs(BudgetCycle Cycle, MarrPolicyVersion Marr, IReadOnlyList<ProposalView> Proposals, PortfolioRules Rules);
