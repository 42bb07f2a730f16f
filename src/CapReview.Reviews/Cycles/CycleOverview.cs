using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Records;

namespace CapReview.Reviews.Cycles;

/// <summary>A cycle as its review page shows it: its proposals with their measures, the sign-offs, and the packets.</summary>
/// <param name="Cycle">The cycle.</param>
/// <param name="Marr">The MARR version it is pinned to.</param>
/// <param name="Rows">Its proposals, each with its measures at the cycle's MARR.</param>
/// <param name="SignOffs">The board's sign-offs so far: those that count, those superseded and those imported.</param>
/// <param name="Packets">The stored packets of a decided cycle; empty before.</param>
/// <param name="PacketsMissing">A decided cycle lacks its cycle packet or a decided proposal's packet.</param>
/// <param name="PacketJob">The job that makes a decided cycle's packets; null before it is decided or when none was queued.</param>
/// <param name="CanSignOff">Whether the actor may sign off the cycle now.</param>
/// <param name="Import">Where the cycle was imported from; null for a cycle opened here.</param>
public sealed record CycleOverview(BudgetCycle Cycle, MarrPolicyVersion Marr, IReadOnlyList<CycleProposalRow> Rows, CycleSignOffs SignOffs,
    IReadOnlyList<PacketSummary> Packets, bool PacketsMissing, PacketJobView? PacketJob, bool CanSignOff, Interchange.CycleImport? Import = null)
{
    /// <summary>The decisions against the board's rules and every budget year's limit; null for those who do not see the proposals yet.</summary>
    public DecisionStanding? Standing { get; init; }

    /// <summary>How many packets a decided cycle gets: one per decided proposal and the cycle's own; 0 before it is decided.</summary>
    public int PacketsExpected { get; init; }
}
