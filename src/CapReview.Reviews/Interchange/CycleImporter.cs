using System.Globalization;
using System.Security.Cryptography;
using CapReview.Engine.Rates;
using CapReview.Engine.Validation;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Portfolio;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Interchange;

/// <summary>What an import did: the new cycle, the references that had to change, and the proposals given to the importer.</summary>
public sealed record CycleImportResult(int CycleId, string CycleName, int Proposals, IReadOnlyDictionary<string, string> RenamedReferences, IReadOnlyList<string> HeldByImporter);

/// <summary>
/// Reads a <see cref="CycleDocument"/> into this installation as a new cycle, for administrators. Everything is
/// checked before anything is written (each problem named by its path in the document, every version's assumptions
/// against their SHA-256), and the whole import is one transaction: it lands completely or not at all.
/// </summary>
public sealed class CycleImporter(ReviewWork work, AuditTrail audit, IPeopleDirectory people, TimeProvider clock, TrustedSigners trusted)
{
    /// <summary>The prefix of the user id recorded for someone who has no account in this installation.</summary>
    public const string ImportedPrefix = "imported:";

    /// <summary>Whether a recorded user id names someone of an imported document rather than a member here.</summary>
    public static bool IsImported(string recordedUserId) =>
        recordedUserId?.StartsWith(ImportedPrefix, StringComparison.Ordinal) ?? false;

    public async Task<CycleImportResult> ImportAsync(Actor actor, byte[] bytes, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(bytes);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can import a cycle.");
        }
        string signature = "unsigned";
        if (SignedCycleDocument.IsPacked(bytes))
        {
            var (content, detached, unpackError) = SignedCycleDocument.Unpack(bytes, CycleDocumentJson.MaxBytes);
            if (unpackError is not null)
            {
                throw new ImportRefusedException([new InputError("document", unpackError)]);
            }
            var (valid, description) = SignedCycleDocument.Verify(content!, detached!, trusted.Sha256Thumbprints);
            if (!valid)
            {
                throw new ImportRefusedException([new InputError("signature", description)]);
            }
            (bytes, signature) = (content!, description);
        }
        var (document, error) = CycleDocumentJson.Read(bytes);
        if (document is null)
        {
            throw new ImportRefusedException([new InputError("document", error ?? "The document is empty.")]);
        }
        var errors = CycleDocumentCheck.Check(document);
        if (errors.Count > 0)
        {
            throw new ImportRefusedException(errors);
        }
        var ids = new Dictionary<string, string>(StringComparer.OrdinalIgnoreCase);
        async Task<string?> UserOf(PersonEntry? person)
        {
            if (person?.Email is not { Length: > 0 } email)
            {
                return null;
            }
            if (!ids.TryGetValue(email, out string? id))
            {
                id = (await people.FindByEmailAsync(email, cancellationToken).ConfigureAwait(false))?.UserId ?? "";
                ids[email] = id;
            }
            return id.Length == 0 ? null : id;
        }
        // The document's decisions, sign-offs and policy were acts of another installation: never recorded as acts of
        // this installation's members, even where an e-mail matches one of them.
        string Recorded(PersonEntry? person) => ImportedPrefix + (person?.Email is { Length: > 0 } email ? email : person?.Name ?? "unknown");

        // Resolve people before the transaction: the directory is another database.
        var owners = new Dictionary<string, string?>(StringComparer.Ordinal);
        foreach (ProposalEntry p in document.Proposals!)
        {
            owners[p.Reference!] = await UserOf(p.Lead).ConfigureAwait(false);
        }
        var authors = new Dictionary<(string, int), string>();
        foreach (ProposalEntry p in document.Proposals!)
        {
            foreach (VersionEntry v in p.Versions!)
            {
                authors[(p.Reference!, v.Number!.Value)] = await UserOf(v.Author).ConfigureAwait(false) ?? owners[p.Reference!] ?? actor.UserId;
            }
        }
        var deciders = (document.Decisions ?? []).Select(d => Recorded(d.DecidedBy)).ToList();
        var signers = (document.SignOffs ?? []).Select(s => Recorded(s.By)).ToList();
        string policySetter = Recorded(document.MarrPolicy!.SetBy);
        string documentHash = Convert.ToHexStringLower(SHA256.HashData(bytes));

        return await work.RunAsync(async db =>
        {
            CycleEntry c = document.Cycle!;
            if (await db.BudgetCycles.AnyAsync(x => x.Name == c.Name, cancellationToken).ConfigureAwait(false))
            {
                throw new ImportRefusedException([new InputError("cycle.name", $"A cycle named “{c.Name}” already exists here; rename it in the document or here first.")]);
            }
            MarrPolicyVersion policy = await PolicyAsync(db, document.MarrPolicy!, policySetter, cancellationToken).ConfigureAwait(false);
            var cycle = BudgetCycle.Imported(
                new NewBudgetCycle(c.Name!.Trim(), c.CapitalLimit!.Value, policy.Id, c.OpensOn!.Value, c.ClosesOn!.Value, c.RequiredSignOffs ?? 2),
                c.Status ?? CycleStatus.Open, c.StudyPeriodYears, c.LaterYearLimits ?? [], c.Objective ?? SelectionObjective.PresentWorth);
            db.BudgetCycles.Add(cycle);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);

            var taken = (await db.Proposals.Select(p => p.Reference).ToListAsync(cancellationToken).ConfigureAwait(false)).ToHashSet(StringComparer.Ordinal);
            var byReference = new Dictionary<string, Proposal>(StringComparer.Ordinal);
            var renamed = new Dictionary<string, string>(StringComparer.Ordinal);
            var held = new List<string>();
            foreach (ProposalEntry entry in document.Proposals!)
            {
                string reference = entry.Reference!;
                var proposal = Proposal.Imported(owners[reference] ?? actor.UserId, entry.Title!.Trim(), entry.Description ?? "",
                    entry.Category ?? ProposalCategory.Other, entry.RiskClass ?? RiskClass.Standard, entry.Status ?? ProposalStatus.Submitted, cycle.Id,
                    // A placeholder until the id is known, unique among the rows being added.
                    taken.Contains(reference) ? $"{Proposal.PlaceholderReference}{Guid.NewGuid():N}"[..20] : reference);
                if (owners[reference] is null)
                {
                    held.Add(reference);
                }
                foreach (VersionEntry v in entry.Versions!)
                {
                    string json = AssumptionsDocument.Serialize(v.Assumptions!);
                    proposal.AddImportedVersion(ProposalVersion.Imported(v.Number!.Value, authors[(reference, v.Number!.Value)], Stored(v.CreatedAt),
                        v.Reason ?? "", json, v.Frozen ?? false, v.FrozenAt is { } frozen ? StorageClock.ToStored(frozen) : null));
                }
                db.Proposals.Add(proposal);
                byReference[reference] = proposal;
            }
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            // References already held here (and those this import keeps) are taken; a clash takes the next free number.
            taken.UnionWith(byReference.Where(x => x.Value.Reference == x.Key).Select(x => x.Key));
            foreach (var (reference, proposal) in byReference.Where(x => x.Value.Reference != x.Key))
            {
                proposal.AssignReference(ProposalReferences.NextFree(proposal.Id, taken));
                taken.Add(proposal.Reference);
                renamed[reference] = proposal.Reference;
            }

            foreach (GroupEntry g in document.ExclusiveGroups ?? [])
            {
                db.ExclusiveGroups.Add(new ExclusiveGroup { BudgetCycleId = cycle.Id, Name = g.Name!.Trim(), Mandatory = g.Mandatory ?? false, ProposalIds = [.. g.Members!.Select(m => byReference[m].Id)] });
            }
            foreach (ContingencyEntry x in document.Contingencies ?? [])
            {
                db.Contingencies.Add(new Contingency { BudgetCycleId = cycle.Id, DependentProposalId = byReference[x.Dependent!].Id, PrerequisiteProposalId = byReference[x.Prerequisite!].Id });
            }
            int k = 0;
            foreach (DecisionEntry d in document.Decisions ?? [])
            {
                var decision = new Decision(byReference[d.Proposal!].Id, cycle.Id, d.Version!.Value, d.AssumptionsSha256!, policy.Id,
                    d.Outcome!.Value, d.Conditions ?? "", deciders[k++], Stored(d.DecidedAt));
                if (!string.IsNullOrWhiteSpace(d.OverriddenRules))
                {
                    // The other installation's record of an override comes with it: a decision never loses why it broke a rule.
                    decision.RecordOverride(d.OverriddenRules, d.OverrideReason!);
                }
                db.Decisions.Add(decision);
            }
            k = 0;
            foreach (SignOffEntry s in document.SignOffs ?? [])
            {
                db.SignOffs.Add(new SignOff(cycle.Id, signers[k++], s.By!.Name!, Stored(s.SignedAt), s.DecisionsSigned ?? "[]"));
            }
            db.CycleImports.Add(new CycleImport(cycle.Id, documentHash, document.Installation is { Length: > 0 } from ? from.Trim() : "not named",
                actor.UserId, actor.DisplayName, clock.GetUtcNow(), signature));
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "cycle.imported", "budget_cycle", cycle.Id.ToString(CultureInfo.InvariantCulture), null,
                new { cycle.Name, DocumentSha256 = documentHash, Signature = signature, Proposals = byReference.Count, Renamed = renamed, HeldByImporter = held, MarrPolicy = policy.Number }, cancellationToken).ConfigureAwait(false);
            return new CycleImportResult(cycle.Id, cycle.Name, byReference.Count, renamed, held);
        }, cancellationToken).ConfigureAwait(false);
    }

    /// <summary>A moment from the document as this installation stores it (UTC, microseconds), or now when it has none.</summary>
    private DateTimeOffset Stored(DateTimeOffset? moment) => moment is { } m ? StorageClock.ToStored(m) : clock.GetUtcNow();

    /// <summary>The policy version here with the same rates, or a new version carrying the document's.</summary>
    private async Task<MarrPolicyVersion> PolicyAsync(CapReviewDbContext db, PolicyEntry p, string setBy, CancellationToken cancellationToken)
    {
        var existing = await db.MarrPolicyVersions.ToListAsync(cancellationToken).ConfigureAwait(false);
        var candidate = new MarrPolicyVersion(existing.Select(m => m.Number).DefaultIfEmpty(0).Max() + 1,
            new NewMarrPolicy(p.Rate!.Value, p.Basis ?? RateBasis.Effective, p.CompoundingsPerYear ?? 1, p.EffectiveFrom!.Value, p.Reason ?? "",
                p.LowRiskPremium ?? 0, p.StandardRiskPremium ?? 0, p.HighRiskPremium ?? 0, p.InflationRate ?? 0, p.RealMarr ?? false, p.AfterTaxRate),
            setBy, clock.GetUtcNow());
        MarrPolicyVersion? same = existing.FirstOrDefault(m => m.Rate == candidate.Rate && m.Basis == candidate.Basis && m.CompoundingsPerYear == candidate.CompoundingsPerYear
            && m.EffectiveFrom == candidate.EffectiveFrom && m.LowRiskPremium == candidate.LowRiskPremium && m.StandardRiskPremium == candidate.StandardRiskPremium
            && m.HighRiskPremium == candidate.HighRiskPremium && m.InflationRate == candidate.InflationRate && m.RealMarr == candidate.RealMarr
            && m.AfterTaxRate == candidate.AfterTaxRate && m.Reason == candidate.Reason);
        if (same is not null)
        {
            return same;
        }
        db.MarrPolicyVersions.Add(candidate);
        await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
        return candidate;
    }
}

/// <summary>An import refused before anything was written, with every problem by its path in the document.</summary>
public sealed class ImportRefusedException(IReadOnlyList<InputError> problems)
    : ReviewException($"The cycle was not imported: {problems.Count} problem(s), the first {Display.FieldWording.Message(problems[0])}")
{
    public IReadOnlyList<InputError> Problems { get; } = problems;
}
