using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Proposals;

/// <summary>
/// Proposals and their versions: a lead creates and edits drafts, submits them to an open cycle (which freezes the
/// version), and any later change makes a new version; every transition follows <see cref="ProposalWorkflow"/>. Each
/// change is recorded in the audit trail in the same transaction.
/// </summary>
public sealed class ProposalService(ReviewWork work, AuditTrail audit, TimeProvider clock)
{
    public Task<ProposalView> CreateDraftAsync(Actor actor, ProposalDraft draft, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        Require(actor, Role.ProjectLead, "Only a project lead can start a proposal.");
        CheckDraft(draft);
        return work.RunAsync(async db =>
        {
            var proposal = Proposal.Start(actor, draft, clock.GetUtcNow());
            db.Proposals.Add(proposal);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            proposal.AssignReference(await ProposalReferences.NextFreeAsync(db, proposal, cancellationToken).ConfigureAwait(false));
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "proposal.created", "proposal", proposal.Reference, null, Summary(proposal), cancellationToken).ConfigureAwait(false);
            return ProposalView.Of(proposal);
        }, cancellationToken);
    }

    /// <summary>
    /// Saves the lead's edits: in place while the latest version is a draft, as a new version (which needs a reason)
    /// once it is frozen. <paramref name="expectedRevision"/> is the revision the lead started from.
    /// </summary>
    public Task<ProposalView> UpdateDraftAsync(Actor actor, int proposalId, int expectedRevision, ProposalDraft draft, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        CheckDraft(draft);
        return work.RunAsync(async db =>
        {
            Proposal proposal = await LoadOwnAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            bool pendingBefore = proposal.PendingRevision is not null;
            proposal.EditDraft(actor, draft, clock.GetUtcNow(), await CycleStatusAsync(db, proposal, cancellationToken).ConfigureAwait(false));
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            // A revision started while the board has the proposal is its own event: the board is told one is pending.
            string action = !pendingBefore && proposal.PendingRevision is not null ? "proposal.revision-started" : "proposal.edited";
            await audit.AppendAsync(db, actor, action, "proposal", proposal.Reference, before, Summary(proposal), cancellationToken).ConfigureAwait(false);
            return ProposalView.Of(proposal);
        }, cancellationToken);
    }

    /// <summary>
    /// Changes the assumptions of the proposal's draft version in place. <paramref name="versionNumber"/> names the
    /// draft the lead edits: a frozen version, or one that is no longer the latest, is refused rather than changed.
    /// </summary>
    public async Task<ProposalView> EditDraftAsync(Actor actor, int proposalId, int versionNumber, int expectedRevision, ProposalAssumptions assumptions, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ProposalView current = await OwnAsync(actor, proposalId, cancellationToken).ConfigureAwait(false);
        VersionView version = current.Version(versionNumber);
        if (version.IsFrozen || version.Number != current.Latest.Number)
        {
            throw new RuleViolationException($"version: version {versionNumber} of {current.Reference} is frozen; revise the proposal to make a new version.");
        }
        return await UpdateDraftAsync(actor, proposalId, expectedRevision, WithAssumptions(current, assumptions, null), cancellationToken).ConfigureAwait(false);
    }

    /// <summary>
    /// Starts a new draft version after a frozen one (a proposal returned for changes, or one the board has while its
    /// cycle is undecided: then a pending revision, <see cref="ProposalView.PendingRevision"/>), from new assumptions and
    /// the reason for the change. The frozen version stays as it was.
    /// </summary>
    public async Task<ProposalView> ReviseAsync(Actor actor, int proposalId, int expectedRevision, ProposalAssumptions assumptions, string reason, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ProposalView current = await OwnAsync(actor, proposalId, cancellationToken).ConfigureAwait(false);
        ProposalDraft draft = WithAssumptions(current, assumptions, reason);
        if (!current.Latest.IsFrozen)
        {
            throw new RuleViolationException($"version: version {current.Latest.Number} of {current.Reference} is still a draft; change it in place.");
        }
        if (string.IsNullOrWhiteSpace(reason))
        {
            throw new RuleViolationException("reason: say why the assumptions changed.");
        }
        if (reason.Trim().Length > 1000)
        {
            throw new RuleViolationException("reason: the reason is longer than 1,000 characters.");
        }
        if (AssumptionsDocument.Serialize(ElementIdentities.Stamp(draft.Assumptions)) == AssumptionsDocument.Serialize(ElementIdentities.Stamp(current.Latest.Assumptions)))
        {
            throw new RuleViolationException($"assumptions: these are the assumptions of version {current.Latest.Number} already; change something to make a new version.");
        }
        return await UpdateDraftAsync(actor, proposalId, expectedRevision, draft, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>Withdraws the lead's own proposal (a draft, submitted, or returned for changes).</summary>
    public Task<ProposalView> WithdrawAsync(Actor actor, int proposalId, int expectedRevision, CancellationToken cancellationToken) =>
        TransitionAsync(actor, proposalId, ProposalStatus.Withdrawn, expectedRevision, cancellationToken);

    private async Task<ProposalView> OwnAsync(Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        ProposalView current = await GetAsync(actor, proposalId, cancellationToken).ConfigureAwait(false);
        return current.OwnerId == actor.UserId ? current : throw new AccessDeniedException("Only the proposal's project lead can change it.");
    }

    private static ProposalDraft WithAssumptions(ProposalView current, ProposalAssumptions? assumptions, string? reason)
    {
        if (assumptions?.Model is null)
        {
            throw new RuleViolationException("assumptions.model: give the model, at least its horizon and elements (a draft may be incomplete).");
        }
        return new ProposalDraft(current.Title, current.Description, current.Category, current.RiskClass, assumptions, reason);
    }

    /// <summary>Submits the latest version to an open cycle and freezes it; the model must be valid.</summary>
    public Task<ProposalView> SubmitAsync(Actor actor, int proposalId, int cycleId, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.RunAsync(async db =>
        {
            Proposal proposal = await LoadOwnAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            // The workflow's refusal comes before a missing cycle's, as it always has.
            proposal.EnsureMayBecome(actor, ProposalStatus.Submitted);
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            ProposalStatus statusBefore = proposal.Status;
            int? replaced = proposal.Versions.Where(v => v.IsFrozen).Select(v => (int?)v.Number).Max();
            proposal.Submit(actor, cycle, clock.GetUtcNow());
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            if (ProposalWorkflow.IsBeforeTheBoard(statusBefore) && replaced is int version)
            {
                // The decisions on the replaced version stay in the record but no longer stand: the board decides again.
                var decisions = await db.Decisions.Where(d => d.ProposalId == proposal.Id && d.VersionNumber == version)
                    .OrderBy(d => d.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
                var superseded = decisions.Select(d => new { Decision = d.Id, Version = d.VersionNumber, Outcome = d.Outcome.ToString() }).ToArray();
                await audit.AppendAsync(db, actor, "proposal.resubmitted", "proposal", proposal.Reference, before,
                    new { After = Summary(proposal), ReplacesVersion = version, SupersededDecisions = superseded }, cancellationToken).ConfigureAwait(false);
            }
            else
            {
                await audit.AppendAsync(db, actor, "proposal.submitted", "proposal", proposal.Reference, before, Summary(proposal), cancellationToken).ConfigureAwait(false);
            }
            return ProposalView.Of(proposal);
        }, cancellationToken);
    }

    /// <summary>Any other workflow transition: a board member's review steps, a lead's withdrawal.</summary>
    public Task<ProposalView> TransitionAsync(Actor actor, int proposalId, ProposalStatus to, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (to == ProposalStatus.Submitted)
        {
            throw new RuleViolationException("Submit a proposal to a cycle with SubmitAsync.");
        }
        if (to is ProposalStatus.Approved or ProposalStatus.Rejected)
        {
            throw new RuleViolationException("Approval and rejection are the board's decisions: record them with the decision service.");
        }
        return work.RunAsync(async db =>
        {
            Proposal proposal = await LoadVisibleAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            switch (to)
            {
                case ProposalStatus.InReview:
                    proposal.StartReview(actor);
                    break;
                case ProposalStatus.ReturnedForChanges:
                    proposal.Return(actor);
                    break;
                case ProposalStatus.Withdrawn:
                    proposal.Withdraw(actor);
                    break;
                default:
                    // No step leads here (back to draft, say): the workflow refuses it with its own words.
                    proposal.EnsureMayBecome(actor, to);
                    throw new InvalidOperationException($"The workflow table allows {to}, but no step of a proposal makes it.");
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, $"proposal.{to.ToString().ToLowerInvariant()}", "proposal", proposal.Reference, before, Summary(proposal), cancellationToken).ConfigureAwait(false);
            return ProposalView.Of(proposal);
        }, cancellationToken);
    }

    public Task<ProposalView> GetAsync(Actor actor, int proposalId, CancellationToken cancellationToken) =>
        work.ReadAsync(async db => ProposalView.Of(await LoadVisibleAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false)), cancellationToken);

    /// <summary>The actor's own proposals, newest first.</summary>
    public Task<IReadOnlyList<ProposalView>> ListOwnAsync(Actor actor, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync<IReadOnlyList<ProposalView>>(async db =>
        {
            var own = await db.Proposals.Include(p => p.Versions).Where(p => p.OwnerId == actor.UserId)
                .OrderByDescending(p => p.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            return [.. own.Select(ProposalView.Of)];
        }, cancellationToken);
    }

    /// <summary>The proposals submitted to a cycle that the actor may see, by reference.</summary>
    public Task<IReadOnlyList<ProposalView>> ListInCycleAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.ReadAsync<IReadOnlyList<ProposalView>>(async db =>
        {
            CycleStatus? status = await db.BudgetCycles.Where(c => c.Id == cycleId).Select(c => (CycleStatus?)c.Status)
                .SingleOrDefaultAsync(cancellationToken).ConfigureAwait(false);
            var inCycle = await db.Proposals.Include(p => p.Versions).Where(p => p.BudgetCycleId == cycleId)
                .OrderBy(p => p.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            return [.. inCycle.Where(p => ProposalAccess.CanSee(actor, p, status)).Select(ProposalView.Of)];
        }, cancellationToken);
    }

    private static async Task<Proposal> LoadVisibleAsync(CapReviewDbContext db, Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        Proposal? proposal = await db.Proposals.Include(p => p.Versions)
            .SingleOrDefaultAsync(p => p.Id == proposalId, cancellationToken).ConfigureAwait(false);
        if (proposal is null || !await ProposalAccess.CanSeeAsync(db, actor, proposal, cancellationToken).ConfigureAwait(false))
        {
            // Another lead's draft is reported exactly like a missing one, so ids reveal nothing.
            throw new NotFoundException("There is no such proposal.");
        }
        return proposal;
    }

    private static async Task<Proposal> LoadOwnAsync(CapReviewDbContext db, Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        Proposal proposal = await LoadVisibleAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
        if (proposal.OwnerId != actor.UserId)
        {
            throw new AccessDeniedException("Only the proposal's project lead can change it.");
        }
        return proposal;
    }

    private static Task<CycleStatus?> CycleStatusAsync(CapReviewDbContext db, Proposal proposal, CancellationToken cancellationToken) =>
        proposal.BudgetCycleId is int cycleId
            ? db.BudgetCycles.Where(c => c.Id == cycleId).Select(c => (CycleStatus?)c.Status).SingleOrDefaultAsync(cancellationToken)
            : Task.FromResult<CycleStatus?>(null);

    /// <summary>Makes the save fail with a conflict when the row is no longer at the revision the user started from.</summary>
    private static void ExpectRevision(CapReviewDbContext db, Proposal proposal, int expectedRevision) =>
        db.Entry(proposal).Property(p => p.Revision).OriginalValue = expectedRevision;

    private static void Require(Actor actor, Role role, string message)
    {
        if (!actor.Has(role))
        {
            throw new AccessDeniedException(message);
        }
    }

    private static void CheckDraft(ProposalDraft draft)
    {
        ArgumentNullException.ThrowIfNull(draft);
        if (string.IsNullOrWhiteSpace(draft.Title))
        {
            throw new RuleViolationException("Give the proposal a title.");
        }
        if (draft.Title.Trim().Length > 200)
        {
            throw new RuleViolationException("The title is longer than 200 characters.");
        }
        if (draft.Description.Length > 4000)
        {
            throw new RuleViolationException("The description is longer than 4,000 characters.");
        }
        if (!Enum.IsDefined(draft.Category) || !Enum.IsDefined(draft.RiskClass))
        {
            throw new RuleViolationException("Choose a category and a risk class from the lists.");
        }
        if (draft.Assumptions?.ValueAtStudyEnd is double value && !(Math.Abs(value) <= CapReview.Engine.CashFlows.CashFlowElement.MaxAmount))
        {
            throw new RuleViolationException("valueAtStudyEnd: the value at the end of the study period must be a number within ±10¹², like any amount.");
        }
        if (draft.Assumptions?.Replacement?.FirstError() is var (field, message))
        {
            throw new RuleViolationException($"{field}: {message}");
        }
        if (draft.Assumptions?.MarrOverride is { } own)
        {
            if (string.IsNullOrWhiteSpace(own.Reason))
            {
                throw new RuleViolationException("Say why the proposal needs a MARR of its own.");
            }
            var rateErrors = CapReview.Engine.Rates.MarrBounds.Check(own.Rate.Value ?? double.NaN,
                own.Rate.Basis ?? CapReview.Engine.Rates.RateBasis.Effective, own.Rate.CompoundingsPerYear ?? 1, "marrOverride.rate");
            if (rateErrors.Count > 0)
            {
                throw new RuleViolationException($"{rateErrors[0].Field}: the proposal's own MARR: " + rateErrors[0].Message);
            }
        }
    }

    private static object Summary(Proposal p) => new
    {
        p.Reference,
        p.Title,
        p.Category,
        p.RiskClass,
        Status = p.Status.ToString(),
        p.BudgetCycleId,
        Versions = p.Versions.OrderBy(v => v.Number).Select(v => new { v.Number, v.IsFrozen, v.AssumptionsHash }).ToArray(),
    };
}
