using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using static CapReview.Web.Demo.DemoElements;
using CapReview.Packets;
using CapReview.Reviews.Access;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Web.Demo;

/// <summary>
/// The demo's last year: "Capital plan 2026", decided and signed off, with its signed packets, so that finance has
/// something to download (invented figures).
/// </summary>
public sealed class DemoDecidedCycle(MarrPolicyService marr, CycleService cycles, ProposalService proposals, DecisionService decisions, PacketService packets)
{
    public async Task WriteAsync(Actor admin, Actor oskar, Actor maren, Actor tove, Actor aino, CancellationToken cancellationToken)
    {
        var policy = await marr.AddVersionAsync(admin, new NewMarrPolicy(0.085, RateBasis.Effective, 1, new DateOnly(2026, 1, 1),
            "Board resolution on the cost of capital for the 2026 plan", LowRiskPremium: -0.01, HighRiskPremium: 0.03), cancellationToken).ConfigureAwait(false);
        BudgetCycle cycle = await cycles.CreateAsync(admin, new NewBudgetCycle("Capital plan 2026", 600_000m, policy.Id,
            new DateOnly(2026, 1, 5), new DateOnly(2026, 3, 27)), cancellationToken).ConfigureAwait(false);

        async Task DecideAsync(Actor lead, string title, string description, ProposalCategory category, ModelSpec model, DecisionOutcome outcome, string conditions)
        {
            var draft = await proposals.CreateDraftAsync(lead, new ProposalDraft(title, description, category, RiskClass.Standard,
                new ProposalAssumptions { Model = model }), cancellationToken).ConfigureAwait(false);
            var submitted = await proposals.SubmitAsync(lead, draft.Id, cycle.Id, draft.Revision, cancellationToken).ConfigureAwait(false);
            await decisions.DecideAsync(tove, submitted.Id, outcome, conditions, submitted.Revision, cancellationToken).ConfigureAwait(false);
        }
        await DecideAsync(oskar, "Compressed-air leak programme", "Find and fix the leaks of the compressed-air network in both halls.",
            ProposalCategory.CostReduction, Model(6, Single("Survey and repairs", CashFlowCategory.Capital, 0, -38_000),
                Uniform("Compressor power saved", CashFlowCategory.Revenue, 1, 6, 14_500)), DecisionOutcome.Approve, "");
        await DecideAsync(maren, "Press line 1 guarding upgrade", "Light curtains and interlocked guards on the four presses of line 1.",
            ProposalCategory.Compliance, Model(10, Single("Guards and light curtains", CashFlowCategory.Capital, 0, -72_000),
                Uniform("Inspection and upkeep", CashFlowCategory.Operating, 1, 10, -1_500)), DecisionOutcome.Approve, "Complete before the safety audit in June");
        await DecideAsync(oskar, "Warehouse racking extension", "Two more aisles of pallet racking in the finished-goods warehouse.",
            ProposalCategory.Expansion, Model(12, Single("Racking and installation", CashFlowCategory.Capital, 0, -210_000),
                Uniform("External storage no longer rented", CashFlowCategory.Revenue, 1, 12, 26_000)), DecisionOutcome.Reject, "Defer until the 2027 volume forecast");

        await decisions.SignOffAsync(tove, cycle.Id, cancellationToken).ConfigureAwait(false);
        await decisions.SignOffAsync(aino, cycle.Id, cancellationToken).ConfigureAwait(false);
        await packets.PublishCycleAsync(tove, cycle.Id, cancellationToken).ConfigureAwait(false);
    }
}
