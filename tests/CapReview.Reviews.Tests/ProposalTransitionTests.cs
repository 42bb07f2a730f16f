using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>The proposal on its own, in memory: each method refuses what the agreed workflow (<see cref="WorkflowTable"/>) does not allow.</summary>
public sealed class ProposalTransitionTests
{
    private static readonly DateTimeOffset At = new(2027, 2, 1, 9, 0, 0, TimeSpan.Zero);

    private static BudgetCycle OpenCycle() =>
        BudgetCycle.Open(new NewBudgetCycle("Capital plan 2027", 1_000_000m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31)));

    /// <summary>A lead's proposal brought to <paramref name="status"/> through the entity's own methods.</summary>
    private static Proposal ProposalIn(ProposalStatus status, BudgetCycle cycle)
    {
        var proposal = Proposal.Start(Lead, Draft(), At);
        if (status == ProposalStatus.Draft)
        {
            return proposal;
        }
        if (status == ProposalStatus.Withdrawn)
        {
            proposal.Withdraw(Lead);
            return proposal;
        }
        proposal.Submit(Lead, cycle, At);
        switch (status)
        {
            case ProposalStatus.InReview:
                proposal.StartReview(Reviewer);
                break;
            case ProposalStatus.Approved:
                proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At);
                break;
            case ProposalStatus.Rejected:
                proposal.Decide(Reviewer, DecisionOutcome.Reject, "", cycle, At);
                break;
            case ProposalStatus.ReturnedForChanges:
                proposal.Return(Reviewer);
                // Revised, so that resubmitting has a draft version to freeze.
                proposal.EditDraft(Lead, Draft(firstCost: -130_000, reason: "Supplier quote"), At);
                break;
        }
        return proposal;
    }

    private static void Move(Proposal proposal, ProposalStatus to, Actor actor, BudgetCycle cycle)
    {
        switch (to)
        {
            case ProposalStatus.Submitted:
                proposal.Submit(actor, cycle, At);
                break;
            case ProposalStatus.InReview:
                proposal.StartReview(actor);
                break;
            // A decided proposal goes back to its lead only as a new decision, which supersedes the one it had.
            case ProposalStatus.ReturnedForChanges when proposal.Status is ProposalStatus.Approved or ProposalStatus.Rejected:
                proposal.Decide(actor, DecisionOutcome.ReturnForChanges, "", cycle, At);
                break;
            case ProposalStatus.ReturnedForChanges:
                proposal.Return(actor);
                break;
            case ProposalStatus.Withdrawn:
                proposal.Withdraw(actor);
                break;
            case ProposalStatus.Approved:
                proposal.Decide(actor, DecisionOutcome.Approve, "", cycle, At);
                break;
            case ProposalStatus.Rejected:
                proposal.Decide(actor, DecisionOutcome.Reject, "", cycle, At);
                break;
            default:
                proposal.EnsureMayBecome(actor, to);
                break;
        }
    }

    public static TheoryData<ProposalStatus, ProposalStatus> EveryPair()
    {
        var data = new TheoryData<ProposalStatus, ProposalStatus>();
        foreach (ProposalStatus from in Enum.GetValues<ProposalStatus>())
        {
            foreach (ProposalStatus to in Enum.GetValues<ProposalStatus>())
            {
                // Submitted to submitted is the resubmission of a revision: a move of its own.
                if (from != to || from == ProposalStatus.Submitted)
                {
                    data.Add(from, to);
                }
            }
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(EveryPair))]
    public void Each_method_makes_only_the_agreed_moves_by_the_agreed_people(ProposalStatus from, ProposalStatus to)
    {
        bool decision = to is ProposalStatus.Approved or ProposalStatus.Rejected;
        foreach (Actor actor in new[] { Lead, OtherLead, Reviewer, Finance, Admin })
        {
            BudgetCycle cycle = OpenCycle();
            Proposal proposal = ProposalIn(from, cycle);
            Assert.Equal(from, proposal.Status);
            if (to == ProposalStatus.Submitted && ProposalWorkflow.IsBeforeTheBoard(from))
            {
                // A resubmission needs the lead's revision to put in place of the version under review.
                proposal.EditDraft(Lead, Draft(firstCost: -150_000, reason: "Revised quote"), At, cycle.Status);
            }
            int revision = proposal.Revision;
            if (WorkflowTable.Permits(from, to, actor, Lead.UserId))
            {
                Move(proposal, to, actor, cycle);
                Assert.Equal(to, proposal.Status);
                Assert.Equal(revision + 1, proposal.Revision);
                continue;
            }
            var error = Record.Exception(() => Move(proposal, to, actor, cycle));
            // The table is consulted first, then the role: a move it lacks is a rule, a wrong person is access.
            // A decision asks for a board member before anything else.
            Type expected = decision
                ? actor.Has(Role.Reviewer) ? typeof(RuleViolationException) : typeof(AccessDeniedException)
                : WorkflowTable.RoleFor(from, to) is null ? typeof(RuleViolationException) : typeof(AccessDeniedException);
            Assert.IsType(expected, error);
            Assert.Equal(from, proposal.Status);
            Assert.Equal(revision, proposal.Revision);
        }
    }

    [Fact]
    public void The_refusal_names_both_statuses_in_words()
    {
        Proposal proposal = ProposalIn(ProposalStatus.Draft, OpenCycle());
        var error = Assert.Throws<RuleViolationException>(() => proposal.StartReview(Reviewer));
        Assert.Equal("A proposal that is draft cannot become in review.", error.Message);
        var denied = Assert.Throws<AccessDeniedException>(() => proposal.Withdraw(OtherLead));
        Assert.Equal("Only the proposal's project lead can do this.", denied.Message);
    }

    [Fact]
    public void Submitting_freezes_the_latest_version_at_the_given_moment_and_pins_the_cycle()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Draft, cycle);
        proposal.Submit(Lead, cycle, At);
        Assert.True(proposal.Latest.IsFrozen);
        Assert.Equal(At, proposal.Latest.FrozenAt);
        Assert.Equal(cycle.Id, proposal.BudgetCycleId);
    }

    [Fact]
    public void A_returned_proposal_is_revised_with_a_reason()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Submitted, cycle);
        proposal.Return(Reviewer);
        var noReason = Assert.Throws<RuleViolationException>(() => proposal.EditDraft(Lead, Draft(firstCost: -130_000), At));
        Assert.StartsWith("Say why the assumptions changed", noReason.Message);
        Assert.Single(proposal.Versions);
        Assert.Throws<AccessDeniedException>(() => proposal.EditDraft(OtherLead, Draft(firstCost: -130_000, reason: "Theirs"), At));

        proposal.EditDraft(Lead, Draft(firstCost: -130_000, reason: "Supplier quote came in higher"), At);
        Assert.Equal([1, 2], proposal.Versions.Select(v => v.Number));
        Assert.True(proposal.Versions[0].IsFrozen);
        Assert.False(proposal.Latest.IsFrozen);
        Assert.Equal("Supplier quote came in higher", proposal.Latest.Reason);
    }

    [Theory]
    [InlineData(ProposalStatus.Approved, "approved")]
    [InlineData(ProposalStatus.Rejected, "rejected")]
    public void A_decided_proposal_goes_back_to_its_lead_only_as_a_new_decision(ProposalStatus decided, string words)
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(decided, cycle);
        proposal.AssignReference("P-0042");
        var error = Assert.Throws<RuleViolationException>(() => proposal.Return(Reviewer));
        Assert.Equal($"P-0042 is {words}: record the return for changes as a decision, which supersedes the one recorded.", error.Message);
        Assert.Equal(decided, proposal.Status);

        Decision returned = proposal.Decide(Reviewer, DecisionOutcome.ReturnForChanges, "  Quote the heat meter too  ", cycle, At);
        Assert.Equal((ProposalStatus.ReturnedForChanges, DecisionOutcome.ReturnForChanges, 1, "Quote the heat meter too"),
            (proposal.Status, returned.Outcome, returned.VersionNumber, returned.Conditions));
        var again = Assert.Throws<RuleViolationException>(() => proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At));
        Assert.Equal("P-0042 is returned for changes: the board decides it again once its lead resubmits it.", again.Message);

        // The lead revises and resubmits; the board decides the new version.
        proposal.EditDraft(Lead, Draft(firstCost: -130_000, reason: "Heat meter quoted"), At, cycle.Status);
        proposal.Submit(Lead, cycle, At);
        Assert.Throws<ConcurrencyConflictException>(() => proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At, judgedVersion: 1));
        Decision decidedAgain = proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At, judgedVersion: 2);
        Assert.Equal((ProposalStatus.Approved, 2), (proposal.Status, decidedAgain.VersionNumber));
    }

    [Fact]
    public void Revising_needs_a_frozen_version_to_follow()
    {
        Proposal proposal = ProposalIn(ProposalStatus.Draft, OpenCycle());
        var error = Assert.Throws<RuleViolationException>(() => proposal.Revise(Lead, "Why not", Draft(firstCost: -1).Assumptions, At));
        Assert.Equal("The latest version is still a draft: edit it instead of starting another.", error.Message);
        Assert.Single(proposal.Versions);
    }

    [Fact]
    public void A_returned_proposal_is_revised_into_a_new_draft_version_that_can_be_submitted()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Submitted, cycle);
        Assert.Throws<RuleViolationException>(() => proposal.Revise(Lead, "Too early", Draft(firstCost: -1).Assumptions, At));
        proposal.Return(Reviewer);
        Assert.Throws<RuleViolationException>(() => proposal.Revise(Lead, " ", Draft(firstCost: -1).Assumptions, At));
        Assert.Throws<AccessDeniedException>(() => proposal.Revise(OtherLead, "Theirs", Draft(firstCost: -1).Assumptions, At));
        proposal.Revise(Lead, "  Quote revised  ", Draft(firstCost: -140_000).Assumptions, At);
        Assert.Equal("Quote revised", proposal.Latest.Reason);
        Assert.Equal(2, proposal.Latest.Number);
        Assert.Equal(-140_000, AssumptionsDocument.Deserialize(proposal.Latest.AssumptionsJson).Model.Elements![0]!.Amount);
        proposal.Submit(Lead, cycle, At);
        Assert.Equal(ProposalStatus.Submitted, proposal.Status);
        Assert.All(proposal.Versions, v => Assert.True(v.IsFrozen));
    }

    [Fact]
    public void Resubmitting_an_unchanged_frozen_version_is_refused()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Submitted, cycle);
        proposal.Return(Reviewer);
        var error = Assert.Throws<RuleViolationException>(() => proposal.Submit(Lead, cycle, At));
        Assert.Equal("A submitted version is frozen: it cannot be changed or deleted. Make a new version instead.", error.Message);
        Assert.Equal(ProposalStatus.ReturnedForChanges, proposal.Status);
    }

    [Fact]
    public void A_cycle_in_review_takes_no_new_proposal()
    {
        BudgetCycle cycle = OpenCycle();
        cycle.StartReview(Admin);
        Proposal proposal = ProposalIn(ProposalStatus.Draft, cycle);
        var error = Assert.Throws<RuleViolationException>(() => proposal.Submit(Lead, cycle, At));
        Assert.Equal("Cycle: the cycle Capital plan 2027 no longer takes proposals.", error.Message);
        Assert.Equal(ProposalStatus.Draft, proposal.Status);
        Assert.False(proposal.Latest.IsFrozen);
    }

    [Fact]
    public void A_decision_cites_the_frozen_version_and_the_cycles_marr()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Submitted, cycle);
        Decision decision = proposal.Decide(Reviewer, DecisionOutcome.Approve, "  Order in March  ", cycle, At);
        Assert.Equal(1, decision.VersionNumber);
        // Outside reference: System.Security.Cryptography.SHA256 over the frozen version's stored JSON, computed here.
        string expected = Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(
            System.Text.Encoding.UTF8.GetBytes(proposal.Versions[0].AssumptionsJson)));
        Assert.Equal(expected, decision.AssumptionsHash);
        Assert.Equal(1, decision.MarrPolicyVersionId);
        Assert.Equal("Order in March", decision.Conditions);
        Assert.Equal(Reviewer.UserId, decision.DecidedBy);
        Assert.Equal(ProposalStatus.Approved, proposal.Status);
    }

    [Fact]
    public void A_quoted_reference_never_changes()
    {
        Proposal proposal = ProposalIn(ProposalStatus.Draft, BudgetCycle.Open(new NewBudgetCycle("C", 1m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 1, 2))));
        proposal.AssignReference("P-0007");
        var error = Assert.Throws<RuleViolationException>(() => proposal.AssignReference("P-0008"));
        Assert.Equal("P-0007 keeps its reference: decisions and packets quote it.", error.Message);
        Assert.Equal("P-0007", proposal.Reference);
    }

    [Theory]
    [InlineData(ProposalStatus.Submitted, CycleStatus.Open)]
    [InlineData(ProposalStatus.InReview, CycleStatus.Open)]
    [InlineData(ProposalStatus.InReview, CycleStatus.InReview)]
    [InlineData(ProposalStatus.Approved, CycleStatus.InReview)]
    [InlineData(ProposalStatus.Rejected, CycleStatus.Open)]
    public void A_proposal_before_the_board_is_revised_beside_the_version_under_review_and_resubmitted_in_its_place(ProposalStatus status, CycleStatus cycleStatus)
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(status, cycle);
        if (cycleStatus == CycleStatus.InReview)
        {
            cycle.StartReview(Admin);
        }
        Assert.Null(proposal.PendingRevision);
        var noReason = Assert.Throws<RuleViolationException>(() => proposal.EditDraft(Lead, Draft(firstCost: -150_000), At, cycle.Status));
        Assert.StartsWith("Say why the assumptions changed", noReason.Message);
        Assert.Throws<AccessDeniedException>(() => proposal.EditDraft(OtherLead, Draft(firstCost: -150_000, reason: "Theirs"), At, cycle.Status));
        var retitled = Assert.Throws<RuleViolationException>(() => proposal.EditDraft(Lead, Draft(title: "Another title", firstCost: -150_000, reason: "Quote"), At, cycle.Status));
        Assert.StartsWith("The board reviews the title, description, category and risk class as submitted", retitled.Message);
        Assert.Single(proposal.Versions);

        proposal.EditDraft(Lead, Draft(firstCost: -150_000, reason: "Supplier quote came in higher"), At, cycle.Status);
        // The board keeps its status and its version; the revision waits beside it.
        Assert.Equal(status, proposal.Status);
        Assert.Equal(2, proposal.PendingRevision?.Number);
        Assert.True(proposal.Versions[0].IsFrozen);
        // Edited again in place while pending: still one revision.
        proposal.EditDraft(Lead, Draft(firstCost: -155_000), At, cycle.Status);
        Assert.Equal([1, 2], proposal.Versions.Select(v => v.Number));

        proposal.Submit(Lead, cycle, At.AddHours(1));
        Assert.Equal(ProposalStatus.Submitted, proposal.Status);
        Assert.Null(proposal.PendingRevision);
        Assert.All(proposal.Versions, v => Assert.True(v.IsFrozen));
        // The board now decides version 2, never version 1 again.
        Decision decision = proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At.AddHours(2));
        Assert.Equal(2, decision.VersionNumber);
        Assert.Equal(-155_000, AssumptionsDocument.Deserialize(proposal.Versions[1].AssumptionsJson).Model.Elements![0]!.Amount);
    }

    [Fact]
    public void A_resubmission_without_a_revision_is_refused_and_the_version_under_review_stays()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.InReview, cycle);
        var error = Assert.Throws<RuleViolationException>(() => proposal.Submit(Lead, cycle, At));
        Assert.Equal("There is no revision to submit: version 1 is the one the board has. Change the assumptions first.", error.Message);
        Assert.Equal(ProposalStatus.InReview, proposal.Status);
    }

    [Fact]
    public void Once_the_cycle_is_decided_a_decided_proposal_is_neither_revised_nor_resubmitted()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Approved, cycle);
        proposal.EditDraft(Lead, Draft(firstCost: -150_000, reason: "Late quote"), At, cycle.Status);
        cycle.MarkDecided(cycle.RequiredSignOffs);
        var edit = Assert.Throws<RuleViolationException>(() => proposal.EditDraft(Lead, Draft(firstCost: -160_000), At, cycle.Status));
        Assert.Equal("A proposal that is approved in a decided cycle cannot be edited.", edit.Message);
        var submit = Assert.Throws<RuleViolationException>(() => proposal.Submit(Lead, cycle, At));
        Assert.Equal("Cycle: the cycle Capital plan 2027 no longer takes proposals.", submit.Message);
        Assert.Equal(ProposalStatus.Approved, proposal.Status);
        Assert.False(proposal.Latest.IsFrozen);
    }

    [Fact]
    public void A_withdrawn_proposal_is_never_revised()
    {
        BudgetCycle cycle = OpenCycle();
        Proposal proposal = ProposalIn(ProposalStatus.Submitted, cycle);
        proposal.Withdraw(Lead);
        var edit = Assert.Throws<RuleViolationException>(() => proposal.EditDraft(Lead, Draft(firstCost: -150_000, reason: "Quote"), At, cycle.Status));
        Assert.Equal("A proposal that is withdrawn cannot be edited.", edit.Message);
    }
}
