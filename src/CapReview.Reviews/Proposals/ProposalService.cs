using CapReview.Engine.Evaluation;
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
            string json = AssumptionsDocument.Serialize(ElementIdentities.Stamp(draft.Assumptions));
            var proposal = new Proposal
            {
                OwnerId = actor.UserId,
                Title = draft.Title.Trim(),
                Description = draft.Description.Trim(),
                Category = draft.Category,
                RiskClass = draft.RiskClass,
            };
            proposal.Versions.Add(NewVersion(1, actor, "First draft", json));
            db.Proposals.Add(proposal);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            proposal.Reference = await ProposalReferences.NextFreeAsync(db, proposal, cancellationToken).ConfigureAwait(false);
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
            if (proposal.Status is not (ProposalStatus.Draft or ProposalStatus.ReturnedForChanges))
            {
                throw new RuleViolationException($"A proposal that is {Describe(proposal.Status)} cannot be edited.");
            }
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            proposal.Title = draft.Title.Trim();
            proposal.Description = draft.Description.Trim();
            proposal.Category = draft.Category;
            proposal.RiskClass = draft.RiskClass;
            string json = AssumptionsDocument.Serialize(ElementIdentities.Stamp(draft.Assumptions));
            ProposalVersion latest = proposal.Versions.OrderBy(v => v.Number).Last();
            if (!latest.IsFrozen)
            {
                latest.AssumptionsJson = json;
                latest.AssumptionsHash = AssumptionsDocument.Hash(json);
                latest.Revision++;
            }
            else if (latest.AssumptionsJson != json && Restamped(latest) != json)
            {
                if (string.IsNullOrWhiteSpace(draft.ChangeReason))
                {
                    throw new RuleViolationException("Say why the assumptions changed: the submitted version stays as it was and the change becomes a new version.");
                }
                proposal.Versions.Add(NewVersion(latest.Number + 1, actor, draft.ChangeReason.Trim(), json));
            }
            proposal.Revision++;
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "proposal.edited", "proposal", proposal.Reference, before, Summary(proposal), cancellationToken).ConfigureAwait(false);
            return ProposalView.Of(proposal);
        }, cancellationToken);
    }

    /// <summary>Submits the latest version to an open cycle and freezes it; the model must be valid.</summary>
    public Task<ProposalView> SubmitAsync(Actor actor, int proposalId, int cycleId, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        return work.RunAsync(async db =>
        {
            Proposal proposal = await LoadOwnAsync(db, actor, proposalId, cancellationToken).ConfigureAwait(false);
            CheckTransition(actor, proposal, ProposalStatus.Submitted);
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            if (proposal.BudgetCycleId is int earlier && earlier != cycle.Id)
            {
                throw new RuleViolationException("A proposal returned for changes goes back to the cycle it came from.");
            }
            // New proposals only while the cycle is open; a returned one may come back while the board still reviews.
            bool resubmission = proposal.BudgetCycleId == cycle.Id;
            if (!(cycle.Status == CycleStatus.Open || (resubmission && cycle.Status == CycleStatus.InReview)))
            {
                throw new RuleViolationException($"The cycle {cycle.Name} no longer takes proposals.");
            }
            ProposalVersion latest = proposal.Versions.OrderBy(v => v.Number).Last();
            var evaluation = Evaluator.Evaluate(AssumptionsDocument.Deserialize(latest.AssumptionsJson).Model);
            if (!evaluation.IsValid && evaluation.Errors.Any(e => e.Field != "rate.value"))
            {
                var first = evaluation.Errors.First(e => e.Field != "rate.value");
                throw new RuleViolationException($"The model is not complete: {first.Field}: {first.Message}");
            }
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            latest.IsFrozen = true;
            latest.FrozenAt = clock.GetUtcNow();
            proposal.Status = ProposalStatus.Submitted;
            proposal.BudgetCycleId = cycle.Id;
            proposal.Revision++;
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "proposal.submitted", "proposal", proposal.Reference, before, Summary(proposal), cancellationToken).ConfigureAwait(false);
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
            CheckTransition(actor, proposal, to);
            object before = Summary(proposal);
            ExpectRevision(db, proposal, expectedRevision);
            proposal.Status = to;
            proposal.Revision++;
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
            var inCycle = await db.Proposals.Include(p => p.Versions).Where(p => p.BudgetCycleId == cycleId)
                .OrderBy(p => p.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            return [.. inCycle.Where(p => ProposalAccess.CanSee(actor, p)).Select(ProposalView.Of)];
        }, cancellationToken);
    }

    private static async Task<Proposal> LoadVisibleAsync(CapReviewDbContext db, Actor actor, int proposalId, CancellationToken cancellationToken)
    {
        Proposal? proposal = await db.Proposals.Include(p => p.Versions)
            .SingleOrDefaultAsync(p => p.Id == proposalId, cancellationToken).ConfigureAwait(false);
        if (proposal is null || !ProposalAccess.CanSee(actor, proposal))
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

    private static void CheckTransition(Actor actor, Proposal proposal, ProposalStatus to)
    {
        Role? needed = ProposalWorkflow.RoleFor(proposal.Status, to);
        if (needed is null)
        {
            throw new RuleViolationException($"A proposal that is {Describe(proposal.Status)} cannot become {Describe(to)}.");
        }
        if (!actor.Has(needed.Value) || (needed == Role.ProjectLead && proposal.OwnerId != actor.UserId))
        {
            throw new AccessDeniedException(needed == Role.ProjectLead
                ? "Only the proposal's project lead can do this."
                : "Only a board member can do this.");
        }
    }

    /// <summary>Makes the save fail with a conflict when the row is no longer at the revision the user started from.</summary>
    private static void ExpectRevision(CapReviewDbContext db, Proposal proposal, int expectedRevision) =>
        db.Entry(proposal).Property(p => p.Revision).OriginalValue = expectedRevision;

    /// <summary>
    /// A frozen version as it would be written today: a document stored before identities, stamped. Saving it
    /// unchanged from the editor (which stamps what it loads) is then no change; the stored text itself is never rewritten.
    /// </summary>
    private static string Restamped(ProposalVersion version) =>
        AssumptionsDocument.Serialize(ElementIdentities.Stamp(AssumptionsDocument.Deserialize(version.AssumptionsJson)));

    private ProposalVersion NewVersion(int number, Actor actor, string reason, string json) => new()
    {
        Number = number,
        AuthorId = actor.UserId,
        CreatedAt = clock.GetUtcNow(),
        Reason = reason,
        AssumptionsJson = json,
        AssumptionsHash = AssumptionsDocument.Hash(json),
    };

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
        if (draft.Assumptions?.ValueAtStudyEnd is double value && !double.IsFinite(value))
        {
            throw new RuleViolationException("valueAtStudyEnd: the value at the end of the study period must be a number.");
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
            var rateErrors = CapReview.Engine.Rates.AnnualRate.Check(own.Rate.Value ?? double.NaN,
                own.Rate.Basis ?? CapReview.Engine.Rates.RateBasis.Effective, own.Rate.CompoundingsPerYear ?? 1, "marrOverride");
            if (rateErrors.Count > 0)
            {
                throw new RuleViolationException("The proposal's own MARR: " + rateErrors[0].Message);
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

    private static string Describe(ProposalStatus status) => status switch
    {
        ProposalStatus.InReview => "in review",
        ProposalStatus.ReturnedForChanges => "returned for changes",
        _ => status.ToString().ToLowerInvariant(),
    };
}
