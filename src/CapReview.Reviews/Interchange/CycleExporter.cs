using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Interchange;

/// <summary>
/// Writes a cycle as a <see cref="CycleDocument"/>: its policy, plan, every proposal submitted to it with all its
/// versions, the portfolio rules, the decisions in the order they were taken, and the sign-offs. For the board and
/// administrators, who may see every proposal of a cycle. Comments and packets stay in the installation.
/// </summary>
public sealed class CycleExporter(ReviewWork work, IPeopleDirectory people, TimeProvider clock)
{
    public async Task<CycleDocument> ExportAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Administrator) && !actor.Has(Role.Reviewer))
        {
            throw new AccessDeniedException("Only board members and administrators can export a whole cycle.");
        }
        var data = await work.ReadAsync(async db =>
        {
            var cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such cycle.");
            var policy = await db.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false);
            var proposals = await db.Proposals.Include(p => p.Versions).Where(p => p.BudgetCycleId == cycleId).OrderBy(p => p.Id)
                .ToListAsync(cancellationToken).ConfigureAwait(false);
            var ids = proposals.Select(p => p.Id).ToList();
            var decisions = await db.Decisions.Where(d => d.BudgetCycleId == cycleId).OrderBy(d => d.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            var signOffs = await db.SignOffs.Where(s => s.BudgetCycleId == cycleId).OrderBy(s => s.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            var groups = await db.ExclusiveGroups.Where(g => g.BudgetCycleId == cycleId).OrderBy(g => g.Name).ToListAsync(cancellationToken).ConfigureAwait(false);
            var contingencies = await db.Contingencies.Where(c => c.BudgetCycleId == cycleId).OrderBy(c => c.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            string installation = await db.Organisations.Select(o => o.Name).FirstOrDefaultAsync(cancellationToken).ConfigureAwait(false) ?? "";
            return (cycle, policy, proposals, decisions, signOffs, groups, contingencies, installation);
        }, cancellationToken).ConfigureAwait(false);

        var names = new Dictionary<string, PersonEntry>(StringComparer.Ordinal);
        async Task<PersonEntry> Person(string userId, string? fallbackName = null)
        {
            if (!names.TryGetValue(userId, out PersonEntry? person))
            {
                // An act imported from another installation is recorded as "imported:" and the e-mail (or name) the
                // document gave; the name is that of the person with that e-mail here, where there is one.
                bool imported = userId.StartsWith(CycleImporter.ImportedPrefix, StringComparison.Ordinal);
                string recorded = imported ? userId[CycleImporter.ImportedPrefix.Length..] : userId;
                KnownPerson? known = imported
                    ? recorded.Contains('@', StringComparison.Ordinal) ? await people.FindByEmailAsync(recorded, cancellationToken).ConfigureAwait(false) : null
                    : await people.FindAsync(userId, cancellationToken).ConfigureAwait(false);
                person = known is not null ? new PersonEntry(known.Name, known.Email)
                    : new PersonEntry(fallbackName ?? recorded, recorded.Contains('@', StringComparison.Ordinal) ? recorded : null);
                names[userId] = person;
            }
            return person;
        }
        var reference = data.proposals.ToDictionary(p => p.Id, p => p.Reference);
        var proposals = new List<ProposalEntry>();
        foreach (Proposal p in data.proposals)
        {
            var versions = new List<VersionEntry>();
            foreach (ProposalVersion v in p.Versions.OrderBy(v => v.Number))
            {
                versions.Add(new VersionEntry
                {
                    Number = v.Number, Author = await Person(v.AuthorId).ConfigureAwait(false), CreatedAt = v.CreatedAt, Reason = v.Reason,
                    Frozen = v.IsFrozen, FrozenAt = v.FrozenAt, AssumptionsSha256 = v.AssumptionsHash, Assumptions = AssumptionsDocument.Deserialize(v.AssumptionsJson),
                });
            }
            proposals.Add(new ProposalEntry
            {
                Reference = p.Reference, Title = p.Title, Description = p.Description, Category = p.Category, RiskClass = p.RiskClass, Status = p.Status,
                Lead = await Person(p.OwnerId).ConfigureAwait(false), Versions = versions,
            });
        }
        var decisions = new List<DecisionEntry>();
        foreach (var d in data.decisions.Where(d => reference.ContainsKey(d.ProposalId)))
        {
            decisions.Add(new DecisionEntry
            {
                Proposal = reference[d.ProposalId], Version = d.VersionNumber, AssumptionsSha256 = d.AssumptionsHash, Outcome = d.Outcome,
                Conditions = d.Conditions, DecidedBy = await Person(d.DecidedBy).ConfigureAwait(false), DecidedAt = d.DecidedAt,
                OverriddenRules = d.Overrides ? d.OverriddenRules : null, OverrideReason = d.Overrides ? d.OverrideReason : null,
            });
        }
        var signOffs = new List<SignOffEntry>();
        foreach (var s in data.signOffs)
        {
            signOffs.Add(new SignOffEntry { By = await Person(s.UserId, s.DisplayName).ConfigureAwait(false), SignedAt = s.SignedAt, DecisionsSigned = s.DecisionsSigned });
        }
        var c = data.cycle;
        MarrPolicyVersion m = data.policy;
        return new CycleDocument
        {
            Format = CycleDocument.FormatName,
            FormatVersion = CycleDocument.CurrentVersion,
            ExportedAt = clock.GetUtcNow(),
            Installation = data.installation,
            Cautions = Common.Cautions.Estimates,
            MarrPolicy = new PolicyEntry
            {
                Rate = m.Rate, Basis = m.Basis, CompoundingsPerYear = m.CompoundingsPerYear, EffectiveFrom = m.EffectiveFrom, LowRiskPremium = m.LowRiskPremium,
                StandardRiskPremium = m.StandardRiskPremium, HighRiskPremium = m.HighRiskPremium, InflationRate = m.InflationRate, RealMarr = m.RealMarr,
                AfterTaxRate = m.AfterTaxRate, Reason = m.Reason, SetBy = await Person(m.SetBy).ConfigureAwait(false), SourceNumber = m.Number, SourceSha256 = MarrPolicyDocument.Hash(m),
            },
            Cycle = new CycleEntry
            {
                Name = c.Name, Status = c.Status, CapitalLimit = c.CapitalLimit, LaterYearLimits = c.LaterYearLimits, StudyPeriodYears = c.StudyPeriodYears,
                Objective = c.Objective, OpensOn = c.OpensOn, ClosesOn = c.ClosesOn, RequiredSignOffs = c.RequiredSignOffs,
            },
            Proposals = proposals,
            ExclusiveGroups = [.. data.groups.Select(g => new GroupEntry(g.Name, g.Mandatory, [.. g.ProposalIds.Where(reference.ContainsKey).Select(id => reference[id]).Order(StringComparer.Ordinal)]))],
            Contingencies = [.. data.contingencies.Where(x => reference.ContainsKey(x.DependentProposalId) && reference.ContainsKey(x.PrerequisiteProposalId))
                .Select(x => new ContingencyEntry(reference[x.DependentProposalId], reference[x.PrerequisiteProposalId]))],
            Decisions = decisions,
            SignOffs = signOffs,
        };
    }
}
