using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Cycles;

/// <summary>A proposal of a cycle as the board reviews it: the version shown, its MARR, its measures, whether the actor may decide it.</summary>
/// <param name="Proposal">The proposal.</param>
/// <param name="VersionNumber">The latest submitted version's number, 0 when none was submitted.</param>
/// <param name="Marr">The cycle's MARR for its risk class.</param>
/// <param name="Evaluation">Its measures at that MARR; null when the model cannot be evaluated.</param>
/// <param name="Decidable">Whether the actor may record a decision on it now.</param>
public sealed record CycleProposalRow(ProposalView Proposal, int VersionNumber, AnnualRate Marr, Evaluation? Evaluation, bool Decidable);
