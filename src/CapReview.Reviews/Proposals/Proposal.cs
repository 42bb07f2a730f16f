using CapReview.Engine.Evaluation;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// One investment idea, owned by a project lead, with its versions of assumptions and its workflow status. Every change
/// goes through a method named for what happens, which refuses what <see cref="ProposalWorkflow"/> does not allow.
/// </summary>
public sealed class Proposal
{
    /// <summary>How an imported proposal's reference starts while its own is not yet known.</summary>
    internal const string PlaceholderReference = "import-";

    private readonly List<ProposalVersion> _versions = [];

    private Proposal()
    {
    }

    public int Id { get; private set; }

    /// <summary>The reference people quote, e.g. P-0007.</summary>
    public string Reference { get; private set; } = "";

    public string OwnerId { get; private set; } = "";

    public string Title { get; private set; } = "";

    public string Description { get; private set; } = "";

    public ProposalCategory Category { get; private set; }

    public RiskClass RiskClass { get; private set; } = RiskClass.Standard;

    public ProposalStatus Status { get; private set; } = ProposalStatus.Draft;

    public int? BudgetCycleId { get; private set; }

    /// <summary>Optimistic concurrency: raised on every change; a stale value makes the save fail.</summary>
    public int Revision { get; private set; }

    public IReadOnlyList<ProposalVersion> Versions => _versions;

    /// <summary>The newest version: the draft being edited, or the last one frozen.</summary>
    public ProposalVersion Latest => _versions.MaxBy(v => v.Number) ?? throw new InvalidOperationException("A proposal always has a version.");

    /// <summary>
    /// The lead's working copy made while the board has the proposal (<see cref="ProposalWorkflow.IsBeforeTheBoard"/>):
    /// the board still reviews and decides the last frozen version until this one is resubmitted.
    /// </summary>
    public ProposalVersion? PendingRevision => ProposalWorkflow.IsBeforeTheBoard(Status) && !Latest.IsFrozen ? Latest : null;

    /// <summary>A lead's new proposal: a draft with its first version.</summary>
    public static Proposal Start(Actor lead, ProposalDraft draft, DateTimeOffset at)
    {
        ArgumentNullException.ThrowIfNull(lead);
        ArgumentNullException.ThrowIfNull(draft);
        if (!lead.Has(Role.ProjectLead))
        {
            throw new AccessDeniedException("Only a project lead can start a proposal.");
        }
        var proposal = new Proposal { OwnerId = lead.UserId };
        proposal.TakeDetails(draft);
        proposal._versions.Add(ProposalVersion.Draft(1, lead.UserId, at, "First draft", Stamped(draft.Assumptions)));
        return proposal;
    }

    /// <summary>
    /// A proposal as another installation recorded it, in the status and cycle the document gives; its versions follow
    /// with <see cref="AddImportedVersion"/>. <paramref name="reference"/> may be a placeholder until the id is known.
    /// </summary>
    internal static Proposal Imported(string ownerId, string title, string description, ProposalCategory category, RiskClass riskClass,
        ProposalStatus status, int budgetCycleId, string reference) => new()
    {
        OwnerId = ownerId,
        Title = title,
        Description = description,
        Category = category,
        RiskClass = riskClass,
        Status = status,
        BudgetCycleId = budgetCycleId,
        Reference = reference,
    };

    internal void AddImportedVersion(ProposalVersion version) => _versions.Add(version);

    /// <summary>Gives the proposal the reference people will quote, once its id is known; a quoted one never changes.</summary>
    public void AssignReference(string reference)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(reference);
        if (Reference.Length > 0 && !Reference.StartsWith(PlaceholderReference, StringComparison.Ordinal))
        {
            throw new RuleViolationException($"{Reference} keeps its reference: decisions and packets quote it.");
        }
        Reference = reference;
    }

    /// <summary>
    /// The lead's edits: in place while the latest version is a draft, as a new version (see <see cref="Revise"/>) once
    /// it is frozen and the assumptions changed. <paramref name="cycleStatus"/> is the status of the proposal's cycle, if
    /// any: a proposal before the board can be revised only while it is open or in review
    /// (<see cref="ProposalWorkflow.IsEditable"/>), and then only its assumptions, since the board reviews the rest as it is.
    /// </summary>
    public void EditDraft(Actor lead, ProposalDraft draft, DateTimeOffset at, CycleStatus? cycleStatus = null)
    {
        ArgumentNullException.ThrowIfNull(lead);
        ArgumentNullException.ThrowIfNull(draft);
        RequireEditableBy(lead, cycleStatus);
        if (ProposalWorkflow.IsBeforeTheBoard(Status) && DetailsDifferFrom(draft))
        {
            throw new RuleViolationException("The board reviews the title, description, category and risk class as submitted: while it has the proposal, a revision changes the assumptions only.");
        }
        string json = Stamped(draft.Assumptions);
        ProposalVersion latest = Latest;
        if (!latest.IsFrozen)
        {
            latest.EditAssumptions(json);
        }
        else if (latest.AssumptionsJson != json && Stamped(AssumptionsDocument.Deserialize(latest.AssumptionsJson)) != json)
        {
            AddRevision(lead, draft.ChangeReason, json, at);
        }
        TakeDetails(draft);
        Revision++;
    }

    /// <summary>
    /// A new draft version after a frozen one, with the reason for the change: the submitted version stays as it was.
    /// </summary>
    public void Revise(Actor lead, string? reason, ProposalAssumptions assumptions, DateTimeOffset at, CycleStatus? cycleStatus = null)
    {
        ArgumentNullException.ThrowIfNull(lead);
        ArgumentNullException.ThrowIfNull(assumptions);
        RequireEditableBy(lead, cycleStatus);
        AddRevision(lead, reason, Stamped(assumptions), at);
        Revision++;
    }

    /// <summary>
    /// Assumptions as written today: every element with its identity, risk targets by identity (<see cref="ElementIdentities"/>).
    /// A frozen version stored before identities is compared in this form too, so saving it unchanged from the editor
    /// (which stamps what it loads) is no change; its stored text itself is never rewritten.
    /// </summary>
    private static string Stamped(ProposalAssumptions assumptions) => AssumptionsDocument.Serialize(ElementIdentities.Stamp(assumptions));

    private void AddRevision(Actor lead, string? reason, string assumptionsJson, DateTimeOffset at)
    {
        ProposalVersion latest = Latest;
        if (!latest.IsFrozen)
        {
            throw new RuleViolationException("The latest version is still a draft: edit it instead of starting another.");
        }
        if (string.IsNullOrWhiteSpace(reason))
        {
            throw new RuleViolationException("Say why the assumptions changed: the submitted version stays as it was and the change becomes a new version.");
        }
        _versions.Add(ProposalVersion.Draft(latest.Number + 1, lead.UserId, at, reason.Trim(), assumptionsJson));
    }

    /// <summary>
    /// Submits the latest version to <paramref name="cycle"/> and freezes it; the model must be valid. A revision made
    /// while the board has the proposal replaces the version under review: the proposal is submitted again, and a
    /// decision recorded on the earlier version no longer stands for it (the board decides the new version).
    /// </summary>
    public void Submit(Actor lead, BudgetCycle cycle, DateTimeOffset at)
    {
        ArgumentNullException.ThrowIfNull(cycle);
        EnsureMayBecome(lead, ProposalStatus.Submitted);
        if (ProposalWorkflow.IsBeforeTheBoard(Status) && PendingRevision is null)
        {
            throw new RuleViolationException($"There is no revision to submit: version {Latest.Number} is the one the board has. Change the assumptions first.");
        }
        if (BudgetCycleId is int earlier && earlier != cycle.Id)
        {
            throw new RuleViolationException("A proposal returned for changes goes back to the cycle it came from.");
        }
        // New proposals only while the cycle is open; a returned one may come back while the board still reviews.
        bool resubmission = BudgetCycleId == cycle.Id;
        if (!(cycle.Status == CycleStatus.Open || (resubmission && cycle.Status == CycleStatus.InReview)))
        {
            throw new RuleViolationException($"cycleId: the cycle {cycle.Name} no longer takes proposals.");
        }
        ProposalVersion latest = Latest;
        var evaluation = Evaluator.Evaluate(AssumptionsDocument.Deserialize(latest.AssumptionsJson).Model);
        // The rate comes from the cycle's MARR, so a model without one of its own is complete.
        if (!evaluation.IsValid && evaluation.Errors.Any(e => e.Field != "rate.value"))
        {
            var first = evaluation.Errors.First(e => e.Field != "rate.value");
            throw new RuleViolationException($"The model is not complete: {first.Field}: {first.Message}");
        }
        latest.Freeze(at);
        Status = ProposalStatus.Submitted;
        BudgetCycleId = cycle.Id;
        Revision++;
    }

    /// <summary>A board member takes a submitted proposal into review.</summary>
    public void StartReview(Actor board) => Move(board, ProposalStatus.InReview);

    /// <summary>
    /// A board member sends the proposal back to its lead for changes. A decided proposal goes back only through a new
    /// decision (<see cref="Decide"/>), so that the decision it had is superseded in the record, never just left behind.
    /// </summary>
    public void Return(Actor board)
    {
        EnsureMayBecome(board, ProposalStatus.ReturnedForChanges);
        if (Status is ProposalStatus.Approved or ProposalStatus.Rejected)
        {
            throw new RuleViolationException($"{Reference} is {ProposalStatusWords.Describe(Status)}: record the return for changes as a decision, which supersedes the one recorded.");
        }
        Move(board, ProposalStatus.ReturnedForChanges);
    }

    /// <summary>The lead takes the proposal out of the workflow.</summary>
    public void Withdraw(Actor lead) => Move(lead, ProposalStatus.Withdrawn);

    /// <summary>
    /// The board's decision on the latest frozen version, at <paramref name="cycle"/>'s MARR; a proposal not yet in review
    /// passes through review. An approval or rejection may be changed while the cycle is undecided, to the other or to a
    /// return for changes, which sends the proposal back to its lead as a first return does (the board decides it again
    /// once resubmitted). Returns the decision to store. Given the version the member judged, a later submitted
    /// version is a conflict, so a decision is never recorded on a version nobody looked at.
    /// </summary>
    public Decision Decide(Actor board, DecisionOutcome outcome, string? conditions, BudgetCycle? cycle, DateTimeOffset at, int? judgedVersion = null)
    {
        ArgumentNullException.ThrowIfNull(board);
        if (!board.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only a board member can decide and sign off.");
        }
        // An approval or a rejection may be changed until the cycle is signed off; the new decision supersedes it.
        if (Status is not (ProposalStatus.Submitted or ProposalStatus.InReview or ProposalStatus.Approved or ProposalStatus.Rejected)
            || BudgetCycleId is not int cycleId || cycle is null || cycle.Id != cycleId)
        {
            throw new RuleViolationException(Status switch
            {
                ProposalStatus.ReturnedForChanges => $"{Reference} is returned for changes: the board decides it again once its lead resubmits it.",
                ProposalStatus.Withdrawn => $"{Reference} was withdrawn by its lead: there is nothing to decide.",
                _ => "Only a submitted proposal can be decided.",
            });
        }
        if (cycle.Status is CycleStatus.Decided or CycleStatus.Closed)
        {
            throw new RuleViolationException($"The cycle {cycle.Name} is already decided.");
        }
        ProposalVersion version = _versions.Where(v => v.IsFrozen).MaxBy(v => v.Number)
            ?? throw new RuleViolationException("Only a submitted proposal can be decided.");
        if (judgedVersion is int judged && judged != version.Number)
        {
            throw new ConcurrencyConflictException($"version: {Reference} was decided on version {judged}, but its latest submitted version is {version.Number}. Look at version {version.Number} and decide again.");
        }
        if (!version.Intact)
        {
            throw new RuleViolationException($"version: the stored assumptions of {Reference} version {version.Number} no longer match their SHA-256; they were changed outside the app and cannot be decided on.");
        }
        ProposalStatus from = Status == ProposalStatus.Submitted ? ProposalStatus.InReview : Status;
        ProposalStatus to = outcome switch
        {
            DecisionOutcome.Approve => ProposalStatus.Approved,
            DecisionOutcome.Reject => ProposalStatus.Rejected,
            DecisionOutcome.ReturnForChanges => ProposalStatus.ReturnedForChanges,
            _ => throw new RuleViolationException("Choose approve, return for changes or reject."),
        };
        if (from == to)
        {
            throw new RuleViolationException($"{Reference} is already {ProposalStatusWords.Describe(to)}: choose another outcome to change the decision.");
        }
        if (ProposalWorkflow.RoleFor(from, to) != Role.Reviewer)
        {
            throw new RuleViolationException("The workflow does not allow this decision now.");
        }
        Status = to;
        Revision++;
        return new Decision(Id, cycleId, version.Number, version.AssumptionsHash, cycle.MarrPolicyVersionId, outcome, (conditions ?? "").Trim(), board.UserId, at);
    }

    /// <summary>
    /// Refuses a move the workflow table does not hold (<see cref="RuleViolationException"/>) or one the actor may not
    /// make (<see cref="AccessDeniedException"/>): the table's role, and for a lead's move, the proposal's own lead.
    /// </summary>
    public void EnsureMayBecome(Actor actor, ProposalStatus to)
    {
        ArgumentNullException.ThrowIfNull(actor);
        Role? needed = ProposalWorkflow.RoleFor(Status, to);
        if (needed is null)
        {
            throw new RuleViolationException($"A proposal that is {ProposalStatusWords.Describe(Status)} cannot become {ProposalStatusWords.Describe(to)}.");
        }
        if (!actor.Has(needed.Value) || (needed == Role.ProjectLead && OwnerId != actor.UserId))
        {
            throw new AccessDeniedException(needed == Role.ProjectLead
                ? "Only the proposal's project lead can do this."
                : "Only a board member can do this.");
        }
    }

    private void Move(Actor actor, ProposalStatus to)
    {
        EnsureMayBecome(actor, to);
        Status = to;
        Revision++;
    }

    private void RequireEditableBy(Actor lead, CycleStatus? cycleStatus)
    {
        if (OwnerId != lead.UserId)
        {
            throw new AccessDeniedException("Only the proposal's project lead can change it.");
        }
        if (!ProposalWorkflow.IsEditable(Status, cycleStatus))
        {
            throw new RuleViolationException(ProposalWorkflow.IsBeforeTheBoard(Status) && cycleStatus is CycleStatus.Decided or CycleStatus.Closed
                ? $"A proposal that is {ProposalStatusWords.Describe(Status)} in a decided cycle cannot be edited."
                : $"A proposal that is {ProposalStatusWords.Describe(Status)} cannot be edited.");
        }
    }

    private bool DetailsDifferFrom(ProposalDraft draft) =>
        Title != draft.Title.Trim() || Description != draft.Description.Trim() || Category != draft.Category || RiskClass != draft.RiskClass;

    private void TakeDetails(ProposalDraft draft)
    {
        Title = draft.Title.Trim();
        Description = draft.Description.Trim();
        Category = draft.Category;
        RiskClass = draft.RiskClass;
    }
}
