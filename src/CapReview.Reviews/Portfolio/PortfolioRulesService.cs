using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// The board's rules for a cycle's portfolio: exclusive groups, contingencies and the plan (study period, limits of
/// later budget years, objective). Board members and administrators set them while the cycle is open or in review;
/// every change is audited in the same transaction.
/// </summary>
public sealed class PortfolioRulesService(ReviewWork work, AuditTrail audit)
{
    public const int MaxLaterYears = 10;

    public Task<PortfolioRules> GetAsync(int cycleId, CancellationToken cancellationToken) =>
        work.ReadAsync(db => LoadAsync(db, cycleId, cancellationToken), cancellationToken);

    /// <summary>The rules as the board and administrators read them, and finance once the cycle is decided; a missing cycle is not found.</summary>
    public Task<PortfolioRules> GetAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the board, finance and administrators see a cycle's portfolio rules.");
        }
        return work.ReadAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            // The rules name the cycle's proposals (groups of alternatives, prerequisites): the ranking's rule applies.
            ProposalAccess.RequireProposalsOf(actor, cycle, "the portfolio rules");
            return await LoadAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
        }, cancellationToken);
    }

    public Task<BudgetCycle> SetPlanAsync(Actor actor, int cycleId, CyclePlan plan, int expectedRevision, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(plan);
        RequireBoard(actor);
        if (plan.StudyPeriodYears is < 1 or > 100)
        {
            throw new RuleViolationException("studyPeriodYears: a study period is 1 to 100 years, or none.");
        }
        if (plan.LaterYearLimits.Count > MaxLaterYears)
        {
            throw new RuleViolationException($"laterYearLimits: a multi-year budget has at most {MaxLaterYears} later years.");
        }
        for (int k = 0; k < plan.LaterYearLimits.Count; k++)
        {
            if (plan.LaterYearLimits[k] < 0m)
            {
                throw new RuleViolationException($"laterYearLimits[{k}]: the limit of budget year {k + 1} cannot be negative.");
            }
        }
        if (!Enum.IsDefined(plan.Objective))
        {
            throw new RuleViolationException("objective: choose present worth or annual worth.");
        }
        return work.RunAsync(async db =>
        {
            BudgetCycle cycle = await EditableCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            var before = new CyclePlan(cycle.StudyPeriodYears, [.. cycle.LaterYearLimits], cycle.Objective);
            db.Entry(cycle).Property(c => c.Revision).OriginalValue = expectedRevision;
            cycle.SetPlan(plan.StudyPeriodYears, plan.LaterYearLimits, plan.Objective);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.plan-changed", "budget_cycle", Id(cycle.Id), before, plan, cancellationToken).ConfigureAwait(false);
            return cycle;
        }, cancellationToken);
    }

    /// <summary>Adds a group, or replaces the members and flag of the group with the same name.</summary>
    public Task<ExclusiveGroup> SaveGroupAsync(Actor actor, int cycleId, GroupDraft draft, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(draft);
        RequireBoard(actor);
        string name = draft.Name?.Trim() ?? "";
        if (name.Length is 0 or > 100)
        {
            throw new RuleViolationException("name: give the group a name of at most 100 characters.");
        }
        var members = draft.ProposalIds.Distinct().Order().ToList();
        if (members.Count < (draft.Mandatory ? 1 : 2))
        {
            throw new RuleViolationException(draft.Mandatory
                ? "proposalIds: a mandatory group needs at least one proposal."
                : "proposalIds: a group of alternatives needs at least two proposals.");
        }
        return work.RunAsync(async db =>
        {
            await EditableCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            await RequireInCycleAsync(db, cycleId, members, cancellationToken).ConfigureAwait(false);
            var rules = await LoadAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            if (rules.Groups.FirstOrDefault(g => g.Name != name && g.ProposalIds.Intersect(members).Any()) is { } other)
            {
                throw new RuleViolationException($"proposalIds: a proposal can be in one group only; one of these is already in {other.Name}.");
            }
            if (rules.Contingencies.Any(c => members.Contains(c.DependentProposalId) && members.Contains(c.PrerequisiteProposalId)))
            {
                throw new RuleViolationException("proposalIds: a proposal and its prerequisite cannot exclude each other.");
            }
            ExclusiveGroup? group = await db.ExclusiveGroups.SingleOrDefaultAsync(g => g.BudgetCycleId == cycleId && g.Name == name, cancellationToken).ConfigureAwait(false);
            object? before = group is null ? null : new GroupDraft(group.Name, group.Mandatory, [.. group.ProposalIds]);
            if (group is null)
            {
                group = new ExclusiveGroup { BudgetCycleId = cycleId, Name = name };
                db.ExclusiveGroups.Add(group);
            }
            group.Mandatory = draft.Mandatory;
            group.ProposalIds = members;
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.group-saved", "budget_cycle", Id(cycleId), before, new GroupDraft(name, draft.Mandatory, members), cancellationToken).ConfigureAwait(false);
            return group;
        }, cancellationToken);
    }

    public Task<bool> RemoveGroupAsync(Actor actor, int cycleId, int groupId, CancellationToken cancellationToken)
    {
        RequireBoard(actor);
        return work.RunAsync(async db =>
        {
            await EditableCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            ExclusiveGroup group = await db.ExclusiveGroups.SingleOrDefaultAsync(g => g.Id == groupId && g.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such group in this cycle.");
            db.ExclusiveGroups.Remove(group);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.group-removed", "budget_cycle", Id(cycleId),
                new GroupDraft(group.Name, group.Mandatory, [.. group.ProposalIds]), null, cancellationToken).ConfigureAwait(false);
            return true;
        }, cancellationToken);
    }

    public Task<Contingency> AddContingencyAsync(Actor actor, int cycleId, int dependentId, int prerequisiteId, CancellationToken cancellationToken)
    {
        RequireBoard(actor);
        if (dependentId == prerequisiteId)
        {
            throw new RuleViolationException("prerequisite: a proposal cannot depend on itself.");
        }
        return work.RunAsync(async db =>
        {
            await EditableCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            await RequireInCycleAsync(db, cycleId, [dependentId, prerequisiteId], cancellationToken).ConfigureAwait(false);
            var rules = await LoadAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            if (rules.Contingencies.Any(c => c.DependentProposalId == dependentId && c.PrerequisiteProposalId == prerequisiteId))
            {
                throw new RuleViolationException("prerequisite: that contingency is already recorded.");
            }
            if (rules.GroupOf(dependentId) is { } group && group.ProposalIds.Contains(prerequisiteId))
            {
                throw new RuleViolationException($"prerequisite: both proposals are alternatives in {group.Name}; one cannot need the other.");
            }
            if (Reaches(rules.Contingencies, prerequisiteId, dependentId))
            {
                throw new RuleViolationException("prerequisite: the contingencies would go round in a circle.");
            }
            var contingency = new Contingency { BudgetCycleId = cycleId, DependentProposalId = dependentId, PrerequisiteProposalId = prerequisiteId };
            db.Contingencies.Add(contingency);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.contingency-added", "budget_cycle", Id(cycleId), null,
                new { Dependent = dependentId, Prerequisite = prerequisiteId }, cancellationToken).ConfigureAwait(false);
            return contingency;
        }, cancellationToken);
    }

    public Task<bool> RemoveContingencyAsync(Actor actor, int cycleId, int contingencyId, CancellationToken cancellationToken)
    {
        RequireBoard(actor);
        return work.RunAsync(async db =>
        {
            await EditableCycleAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            Contingency contingency = await db.Contingencies.SingleOrDefaultAsync(c => c.Id == contingencyId && c.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such contingency in this cycle.");
            db.Contingencies.Remove(contingency);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.contingency-removed", "budget_cycle", Id(cycleId),
                new { Dependent = contingency.DependentProposalId, Prerequisite = contingency.PrerequisiteProposalId }, null, cancellationToken).ConfigureAwait(false);
            return true;
        }, cancellationToken);
    }

    internal static async Task<PortfolioRules> LoadAsync(CapReviewDbContext db, int cycleId, CancellationToken cancellationToken)
    {
        var groups = await db.ExclusiveGroups.Where(g => g.BudgetCycleId == cycleId).OrderBy(g => g.Name).ToListAsync(cancellationToken).ConfigureAwait(false);
        var contingencies = await db.Contingencies.Where(c => c.BudgetCycleId == cycleId).OrderBy(c => c.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
        return new PortfolioRules(groups, contingencies);
    }

    private static void RequireBoard(Actor actor)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Reviewer) && !actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only the review board or an administrator can set a cycle's portfolio rules.");
        }
    }

    private static async Task<BudgetCycle> EditableCycleAsync(CapReviewDbContext db, int cycleId, CancellationToken cancellationToken)
    {
        BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
            ?? throw new NotFoundException("There is no such budget cycle.");
        if (cycle.Status is not (CycleStatus.Open or CycleStatus.InReview))
        {
            throw new RuleViolationException($"The cycle {cycle.Name} is {cycle.Status}: its portfolio rules can no longer change.");
        }
        return cycle;
    }

    private static async Task RequireInCycleAsync(CapReviewDbContext db, int cycleId, IReadOnlyList<int> proposalIds, CancellationToken cancellationToken)
    {
        int found = await db.Proposals.CountAsync(p => proposalIds.Contains(p.Id) && p.BudgetCycleId == cycleId, cancellationToken).ConfigureAwait(false);
        if (found != proposalIds.Distinct().Count())
        {
            throw new RuleViolationException("proposalIds: every proposal must have been submitted to this cycle.");
        }
    }

    /// <summary>Whether <paramref name="from"/> already needs <paramref name="to"/>, directly or through others.</summary>
    private static bool Reaches(IReadOnlyList<Contingency> contingencies, int from, int to)
    {
        var seen = new HashSet<int>();
        var next = new Stack<int>([from]);
        while (next.TryPop(out int at))
        {
            if (at == to)
            {
                return true;
            }
            if (seen.Add(at))
            {
                foreach (var c in contingencies.Where(c => c.DependentProposalId == at))
                {
                    next.Push(c.PrerequisiteProposalId);
                }
            }
        }
        return false;
    }

    private static string Id(int id) => id.ToString(CultureInfo.InvariantCulture);
}
