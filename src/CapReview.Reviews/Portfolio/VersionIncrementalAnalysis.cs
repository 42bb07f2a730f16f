using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Portfolio;

/// <summary>The incremental analysis of the exclusive group a ranked version belongs to.</summary>
/// <param name="Proposal">The proposal asked about.</param>
/// <param name="Version">Its version, the one its cycle ranks.</param>
/// <param name="Analysis">The analysis of its group at the group's MARR, or why the group cannot be analysed.</param>
public sealed record VersionIncrementalAnalysis(ProposalView Proposal, int Version, GroupAnalysis Analysis);
