using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

public sealed class WorkflowTests(ReviewsDatabase db) : IClassFixture<ReviewsDatabase>
{
    public static TheoryData<ProposalStatus, ProposalStatus> EveryPair()
    {
        var data = new TheoryData<ProposalStatus, ProposalStatus>();
        foreach (ProposalStatus from in Enum.GetValues<ProposalStatus>())
        {
            foreach (ProposalStatus to in Enum.GetValues<ProposalStatus>())
            {
                if (from != to && to != ProposalStatus.Submitted)
                {
                    data.Add(from, to);
                }
            }
        }
        return data;
    }

    /// <summary>A proposal of the lead's, submitted to a cycle, then put in <paramref name="status"/> directly (test arrangement).</summary>
    private async Task<ProposalView> ProposalInAsync(ProposalStatus status)
    {
        var cycle = await db.OpenCycleAsync($"Workflow {Guid.NewGuid():N}");
        var draft = await db.Proposals.CreateDraftAsync(Lead, Draft(), CancellationToken.None);
        await db.Proposals.SubmitAsync(Lead, draft.Id, cycle.Id, draft.Revision, CancellationToken.None);
        await using var context = db.NewContext();
        // A proposal is no longer an open bag of setters; the arrangement writes the row directly.
        await context.Proposals.Where(p => p.Id == draft.Id)
            .ExecuteUpdateAsync(s => s.SetProperty(p => p.Status, status).SetProperty(p => p.Revision, 100));
        return await db.Proposals.GetAsync(Lead, draft.Id, CancellationToken.None);
    }

    [Theory]
    [MemberData(nameof(EveryPair))]
    public async Task Only_the_allowed_transitions_by_the_allowed_role_succeed(ProposalStatus from, ProposalStatus to)
    {
        // A decided proposal goes back to its lead only as a new decision, which supersedes the one it had.
        bool decision = to is ProposalStatus.Approved or ProposalStatus.Rejected
            || (to == ProposalStatus.ReturnedForChanges && from is ProposalStatus.Approved or ProposalStatus.Rejected);
        DecisionOutcome outcome = to switch
        {
            ProposalStatus.Approved => DecisionOutcome.Approve,
            ProposalStatus.Rejected => DecisionOutcome.Reject,
            _ => DecisionOutcome.ReturnForChanges,
        };
        foreach (Actor actor in new[] { Lead, OtherLead, Reviewer, Finance, Admin })
        {
            var proposal = await ProposalInAsync(from);
            bool permitted = WorkflowTable.Permits(from, to, actor, Lead.UserId);
            // Approval and rejection go through the board's decision; every other step through the transition itself.
            Func<Task> act = decision
                ? () => db.Decisions.DecideAsync(actor, proposal.Id, outcome, "", proposal.Revision, CancellationToken.None)
                : () => db.Proposals.TransitionAsync(actor, proposal.Id, to, proposal.Revision, CancellationToken.None);
            if (permitted)
            {
                await act();
                Assert.Equal(to, (await db.Proposals.GetAsync(Admin, proposal.Id, CancellationToken.None)).Status);
            }
            else
            {
                var error = await Record.ExceptionAsync(act);
                Assert.IsAssignableFrom<ReviewException>(error);
                Assert.Equal(from, (await db.Proposals.GetAsync(Admin, proposal.Id, CancellationToken.None)).Status);
            }
        }
    }

    [Theory]
    [InlineData(ProposalStatus.Approved)]
    [InlineData(ProposalStatus.Rejected)]
    public async Task A_decided_proposal_is_not_returned_by_a_bare_transition_that_would_leave_its_decision_standing(ProposalStatus decided)
    {
        var proposal = await ProposalInAsync(decided);
        var error = await Assert.ThrowsAsync<RuleViolationException>(() =>
            db.Proposals.TransitionAsync(Reviewer, proposal.Id, ProposalStatus.ReturnedForChanges, proposal.Revision, CancellationToken.None));
        Assert.EndsWith("record the return for changes as a decision, which supersedes the one recorded.", error.Message, StringComparison.Ordinal);
        Assert.Equal(decided, (await db.Proposals.GetAsync(Admin, proposal.Id, CancellationToken.None)).Status);
    }

    [Fact]
    public void The_production_table_holds_exactly_the_agreed_transitions()
    {
        var agreed = WorkflowTable.Allowed.OrderBy(t => t.From).ThenBy(t => t.To).ToArray();
        var production = ProposalWorkflow.Transitions.OrderBy(t => t.From).ThenBy(t => t.To).ToArray();
        Assert.Equal(agreed, production);
    }
}
