using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Cycles;

/// <summary>
/// A review round: its capital limit, the MARR version it is pinned to, its dates and status. It moves only forward:
/// open, in review (administrator), decided (by its board sign-offs), closed (administrator).
/// </summary>
public sealed class BudgetCycle
{
    private BudgetCycle()
    {
    }

    public int Id { get; private set; }

    public string Name { get; private set; } = "";

    /// <summary>Capital that may be committed in the cycle, in the organisation's currency.</summary>
    public decimal CapitalLimit { get; private set; }

    /// <summary>The MARR policy version every evaluation in the cycle uses; later policy versions do not change it.</summary>
    public int MarrPolicyVersionId { get; private set; }

    public DateOnly OpensOn { get; private set; }

    public DateOnly ClosesOn { get; private set; }

    public CycleStatus Status { get; private set; } = CycleStatus.Open;

    /// <summary>Board sign-offs the cycle's decision needs.</summary>
    public int RequiredSignOffs { get; private set; } = 2;

    /// <summary>A board-set study period in years for the ranking, or null to rank by annual worth over each life.</summary>
    public int? StudyPeriodYears { get; private set; }

    /// <summary>Capital limits for budget years 1, 2, … of a multi-year budget; year 0 is <see cref="CapitalLimit"/>.</summary>
    public List<decimal> LaterYearLimits { get; private set; } = [];

    public SelectionObjective Objective { get; private set; } = SelectionObjective.PresentWorth;

    public int Revision { get; private set; }

    /// <summary>Refuses terms no cycle may have, with the message the administrator sees.</summary>
    public static void CheckTerms(NewBudgetCycle terms)
    {
        ArgumentNullException.ThrowIfNull(terms);
        if (string.IsNullOrWhiteSpace(terms.Name) || terms.Name.Trim().Length > 200)
        {
            throw new RuleViolationException("name: give the cycle a name of at most 200 characters.");
        }
        if (terms.CapitalLimit <= 0m)
        {
            throw new RuleViolationException("capitalLimit: the capital limit must be above zero.");
        }
        // The column holds 16 digits before the point (numeric(18, 2)); PostgreSQL would refuse a larger limit with an error.
        if (terms.CapitalLimit >= 10_000_000_000_000_000m)
        {
            throw new RuleViolationException("capitalLimit: the capital limit must be less than 10,000,000,000,000,000.");
        }
        if (terms.ClosesOn < terms.OpensOn)
        {
            throw new RuleViolationException("closesOn: the cycle closes before it opens.");
        }
        if (terms.RequiredSignOffs is < 1 or > 20)
        {
            throw new RuleViolationException("requiredSignOffs: a cycle's decision needs between 1 and 20 sign-offs.");
        }
    }

    /// <summary>A new cycle, open for proposals.</summary>
    public static BudgetCycle Open(NewBudgetCycle terms)
    {
        CheckTerms(terms);
        return new BudgetCycle
        {
            Name = terms.Name.Trim(),
            CapitalLimit = terms.CapitalLimit,
            MarrPolicyVersionId = terms.MarrPolicyVersionId,
            OpensOn = terms.OpensOn,
            ClosesOn = terms.ClosesOn,
            RequiredSignOffs = terms.RequiredSignOffs,
        };
    }

    /// <summary>A cycle as another installation recorded it, in whatever status the document gives (checked by the importer).</summary>
    public static BudgetCycle Imported(NewBudgetCycle terms, CycleStatus status, int? studyPeriodYears, IEnumerable<decimal> laterYearLimits, SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(terms);
        ArgumentNullException.ThrowIfNull(laterYearLimits);
        return new BudgetCycle
        {
            Name = terms.Name.Trim(),
            CapitalLimit = terms.CapitalLimit,
            MarrPolicyVersionId = terms.MarrPolicyVersionId,
            OpensOn = terms.OpensOn,
            ClosesOn = terms.ClosesOn,
            RequiredSignOffs = terms.RequiredSignOffs,
            Status = status,
            StudyPeriodYears = studyPeriodYears,
            LaterYearLimits = [.. laterYearLimits],
            Objective = objective,
        };
    }

    /// <summary>An administrator ends submissions: an open cycle goes into review.</summary>
    public void StartReview(Actor admin) => Move(admin, CycleStatus.Open, CycleStatus.InReview);

    /// <summary>An administrator closes a decided cycle.</summary>
    public void Close(Actor admin) => Move(admin, CycleStatus.Decided, CycleStatus.Closed);

    /// <summary>The cycle becomes decided once <paramref name="signOffs"/> reach the required number, and only then.</summary>
    public void MarkDecided(int signOffs)
    {
        if (Status is not (CycleStatus.Open or CycleStatus.InReview))
        {
            throw new RuleViolationException($"The cycle {Name} is already decided.");
        }
        if (signOffs < RequiredSignOffs)
        {
            throw new RuleViolationException("A cycle is decided by its board sign-offs.");
        }
        Status = CycleStatus.Decided;
        Revision++;
    }

    /// <summary>
    /// A board member signs off every decision of the cycle as it stands (<paramref name="decisionsSigned"/>, as JSON):
    /// refused while a proposal is still open, or when they have signed this same set already
    /// (<paramref name="alreadySigned"/>). <paramref name="signOffsBefore"/> counts the earlier sign-offs of this same
    /// set only; the last required one makes the cycle decided.
    /// </summary>
    public SignOff SignOff(Actor board, IReadOnlyCollection<Proposal> proposals, bool alreadySigned, int signOffsBefore, string decisionsSigned, DateTimeOffset at)
    {
        ArgumentNullException.ThrowIfNull(board);
        ArgumentNullException.ThrowIfNull(proposals);
        if (!board.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
        if (Status is CycleStatus.Decided or CycleStatus.Closed)
        {
            throw new RuleViolationException($"The cycle {Name} is already decided.");
        }
        var open = proposals.Where(p => p.Status is ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.ReturnedForChanges).ToList();
        if (proposals.Count == 0 || open.Count > 0)
        {
            throw new RuleViolationException(proposals.Count == 0
                ? "The cycle has no proposals to sign off."
                : $"Decide every proposal first: {string.Join(", ", open.Select(p => p.Reference))} still open.");
        }
        if (alreadySigned)
        {
            throw new RuleViolationException("You have already signed off this cycle's decisions as they stand.");
        }
        var signOff = new SignOff(Id, board.UserId, board.DisplayName, at, decisionsSigned);
        if (signOffsBefore + 1 >= RequiredSignOffs)
        {
            MarkDecided(signOffsBefore + 1);
        }
        return signOff;
    }

    /// <summary>
    /// An administrator corrects the cycle's capital limit and dates while it is open, under the same rules as a new
    /// cycle's; once its review has started, proposals were judged against these terms and they stand.
    /// </summary>
    public void Correct(Actor admin, CycleCorrection correction)
    {
        ArgumentNullException.ThrowIfNull(admin);
        ArgumentNullException.ThrowIfNull(correction);
        if (!admin.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can correct a cycle.");
        }
        if (Status != CycleStatus.Open)
        {
            throw new RuleViolationException($"The cycle {Name} is no longer open: its dates and capital limit stand as they are.");
        }
        CheckTerms(new NewBudgetCycle(Name, correction.CapitalLimit, MarrPolicyVersionId, correction.OpensOn, correction.ClosesOn, RequiredSignOffs));
        if (correction == CycleCorrection.Of(this))
        {
            throw new RuleViolationException("The dates and the capital limit are as they were: there is nothing to correct.");
        }
        CapitalLimit = correction.CapitalLimit;
        OpensOn = correction.OpensOn;
        ClosesOn = correction.ClosesOn;
        Revision++;
    }

    /// <summary>The board's plan: a study period, later years' limits and what the selection maximises; only while the cycle is undecided.</summary>
    public void SetPlan(int? studyPeriodYears, IEnumerable<decimal> laterYearLimits, SelectionObjective objective)
    {
        ArgumentNullException.ThrowIfNull(laterYearLimits);
        if (Status is not (CycleStatus.Open or CycleStatus.InReview))
        {
            throw new RuleViolationException($"The cycle {Name} is {Status}: its portfolio rules can no longer change.");
        }
        StudyPeriodYears = studyPeriodYears;
        LaterYearLimits = [.. laterYearLimits];
        Objective = objective;
        Revision++;
    }

    private void Move(Actor admin, CycleStatus from, CycleStatus to)
    {
        ArgumentNullException.ThrowIfNull(admin);
        if (!admin.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can move a cycle on.");
        }
        if (Status != from)
        {
            throw new RuleViolationException($"A cycle that is {Status} cannot become {to}.");
        }
        Status = to;
        Revision++;
    }
}
