using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using static CapReview.Reviews.Tests.ReviewsDatabase;

namespace CapReview.Reviews.Tests;

/// <summary>The budget cycle on its own, in memory: it moves only forward, and only by the agreed hands.</summary>
public sealed class BudgetCycleTransitionTests
{
    private static readonly DateTimeOffset At = new(2027, 3, 30, 14, 0, 0, TimeSpan.Zero);

    /// <summary>The agreed moves an administrator makes; a cycle becomes decided only through its sign-offs.</summary>
    public static TheoryData<CycleStatus, CycleStatus, bool> AdministratorMoves => new()
    {
        { CycleStatus.Open, CycleStatus.InReview, true },
        { CycleStatus.Open, CycleStatus.Closed, false },
        { CycleStatus.InReview, CycleStatus.InReview, false },
        { CycleStatus.InReview, CycleStatus.Closed, false },
        { CycleStatus.Decided, CycleStatus.InReview, false },
        { CycleStatus.Decided, CycleStatus.Closed, true },
        { CycleStatus.Closed, CycleStatus.InReview, false },
        { CycleStatus.Closed, CycleStatus.Closed, false },
    };

    private static BudgetCycle NewCycle(int requiredSignOffs = 1) =>
        BudgetCycle.Open(new NewBudgetCycle("Capital plan 2027", 1_000_000m, 1, new DateOnly(2027, 1, 1), new DateOnly(2027, 3, 31), requiredSignOffs));

    private static Proposal Submitted(BudgetCycle cycle)
    {
        var proposal = Proposal.Start(Lead, Draft(), At);
        proposal.Submit(Lead, cycle, At);
        return proposal;
    }

    private static Proposal Decided(BudgetCycle cycle)
    {
        Proposal proposal = Submitted(cycle);
        proposal.Decide(Reviewer, DecisionOutcome.Approve, "", cycle, At);
        return proposal;
    }

    private static BudgetCycle CycleIn(CycleStatus status)
    {
        BudgetCycle cycle = NewCycle();
        if (status == CycleStatus.InReview)
        {
            cycle.StartReview(Admin);
        }
        if (status is CycleStatus.Decided or CycleStatus.Closed)
        {
            cycle.SignOff(Reviewer, [Decided(cycle)], false, 0, "[]", At);
        }
        if (status == CycleStatus.Closed)
        {
            cycle.Close(Admin);
        }
        Assert.Equal(status, cycle.Status);
        return cycle;
    }

    [Theory]
    [MemberData(nameof(AdministratorMoves))]
    public void An_administrator_moves_a_cycle_only_forward(CycleStatus from, CycleStatus to, bool allowed)
    {
        BudgetCycle cycle = CycleIn(from);
        int revision = cycle.Revision;
        Action move = to == CycleStatus.InReview ? () => cycle.StartReview(Admin) : () => cycle.Close(Admin);
        if (allowed)
        {
            move();
            Assert.Equal(to, cycle.Status);
            Assert.Equal(revision + 1, cycle.Revision);
            return;
        }
        var error = Assert.Throws<RuleViolationException>(move);
        Assert.Equal($"A cycle that is {from} cannot become {to}.", error.Message);
        Assert.Equal(from, cycle.Status);
        Assert.Equal(revision, cycle.Revision);
    }

    [Fact]
    public void Only_an_administrator_moves_a_cycle()
    {
        BudgetCycle open = CycleIn(CycleStatus.Open);
        var error = Assert.Throws<AccessDeniedException>(() => open.StartReview(Reviewer));
        Assert.Equal("Only an administrator can move a cycle on.", error.Message);
        BudgetCycle decided = CycleIn(CycleStatus.Decided);
        Assert.Throws<AccessDeniedException>(() => decided.Close(Lead));
        Assert.Equal(CycleStatus.Open, open.Status);
        Assert.Equal(CycleStatus.Decided, decided.Status);
    }

    [Fact]
    public void A_cycle_is_decided_only_when_its_sign_offs_reach_the_required_number()
    {
        BudgetCycle cycle = NewCycle(requiredSignOffs: 2);
        var error = Assert.Throws<RuleViolationException>(() => cycle.MarkDecided(1));
        Assert.Equal("A cycle is decided by its board sign-offs.", error.Message);
        Assert.Equal(CycleStatus.Open, cycle.Status);

        Proposal proposal = Decided(cycle);
        SignOff first = cycle.SignOff(Reviewer, [proposal], false, 0, "[]", At);
        Assert.Equal(CycleStatus.Open, cycle.Status);
        Assert.Equal(Reviewer.UserId, first.UserId);
        Assert.Equal("Tove Board", first.DisplayName);
        cycle.SignOff(SecondReviewer, [proposal], false, 1, "[]", At);
        Assert.Equal(CycleStatus.Decided, cycle.Status);
        Assert.Throws<RuleViolationException>(() => cycle.MarkDecided(2));
    }

    [Fact]
    public void A_sign_off_is_refused_while_a_proposal_is_open_twice_by_one_member_and_by_anyone_off_the_board()
    {
        BudgetCycle cycle = NewCycle(requiredSignOffs: 2);
        Proposal open = Submitted(cycle);
        open.AssignReference("P-0042");
        Proposal decided = Decided(cycle);
        var early = Assert.Throws<RuleViolationException>(() => cycle.SignOff(Reviewer, [open, decided], false, 0, "[]", At));
        Assert.Equal("Decide every proposal first: P-0042 still open.", early.Message);
        var empty = Assert.Throws<RuleViolationException>(() => cycle.SignOff(Reviewer, [], false, 0, "[]", At));
        Assert.Equal("The cycle has no proposals to sign off.", empty.Message);
        var twice = Assert.Throws<RuleViolationException>(() => cycle.SignOff(Reviewer, [decided], true, 1, "[]", At));
        Assert.Equal("You have already signed off this cycle's decisions as they stand.", twice.Message);
        Assert.Throws<AccessDeniedException>(() => cycle.SignOff(Finance, [decided], false, 0, "[]", At));
        Assert.Equal(CycleStatus.Open, cycle.Status);
    }

    [Fact]
    public void A_decided_cycle_takes_no_more_sign_offs_decisions_or_plan_changes()
    {
        BudgetCycle cycle = CycleIn(CycleStatus.Decided);
        var signOff = Assert.Throws<RuleViolationException>(() => cycle.SignOff(SecondReviewer, [], false, 1, "[]", At));
        Assert.Equal("The cycle Capital plan 2027 is already decided.", signOff.Message);
        var plan = Assert.Throws<RuleViolationException>(() => cycle.SetPlan(5, [100m], SelectionObjective.AnnualWorth));
        Assert.Equal("The cycle Capital plan 2027 is Decided: its portfolio rules can no longer change.", plan.Message);
        Assert.Null(cycle.StudyPeriodYears);
        Assert.Empty(cycle.LaterYearLimits);
    }

    [Fact]
    public void An_open_cycle_takes_the_boards_plan()
    {
        BudgetCycle cycle = NewCycle();
        cycle.SetPlan(8, [250_000m, 100_000m], SelectionObjective.AnnualWorth);
        Assert.Equal(8, cycle.StudyPeriodYears);
        Assert.Equal([250_000m, 100_000m], cycle.LaterYearLimits);
        Assert.Equal(SelectionObjective.AnnualWorth, cycle.Objective);
        Assert.Equal(1, cycle.Revision);
    }
}
