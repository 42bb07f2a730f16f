using System.Globalization;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Interchange;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Audit;

/// <summary>
/// The audit trail filtered by proposal, person and days, with people and items named: what the audit page shows,
/// what the API answers and what the CSV export holds, from this one query.
/// </summary>
public sealed class AuditSearch(ReviewWork work, IPeopleDirectory people)
{
    /// <summary>The most events one answer holds; an export asks for all of them.</summary>
    public const int MaxRows = 100_000;

    public Task<AuditSearchResult> SearchAsync(Actor actor, AuditFilter filter, int limit, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(filter);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can read the audit trail.");
        }
        if (filter.From is DateOnly from && filter.To is DateOnly to && to < from)
        {
            throw new RuleViolationException("to: the last day comes before the first day.");
        }
        limit = Math.Clamp(limit, 1, MaxRows);
        string? reference = string.IsNullOrWhiteSpace(filter.ProposalReference) ? null : filter.ProposalReference.Trim();
        string? userId = string.IsNullOrWhiteSpace(filter.UserId) ? null : filter.UserId.Trim();
        return work.ReadAsync(async db =>
        {
            if (reference is not null && !await db.Proposals.AnyAsync(p => p.Reference == reference, cancellationToken).ConfigureAwait(false))
            {
                throw new RuleViolationException($"proposal: there is no proposal {reference}.");
            }
            IQueryable<AuditEvent> query = db.AuditEvents.AsNoTracking();
            if (reference is not null)
            {
                query = query.Where(e => e.EntityType == "proposal" && e.EntityId == reference);
            }
            if (userId is not null)
            {
                query = query.Where(e => e.UserId == userId);
            }
            // The days are compared here rather than in SQL: SQLite stores the time as text and cannot compare it as a time.
            var found = new List<AuditEvent>();
            bool more = false;
            await foreach (AuditEvent e in query.OrderByDescending(e => e.Id).AsAsyncEnumerable().WithCancellation(cancellationToken).ConfigureAwait(false))
            {
                var day = DateOnly.FromDateTime(e.At.UtcDateTime);
                if ((filter.From is DateOnly first && day < first) || (filter.To is DateOnly last && day > last))
                {
                    continue;
                }
                if (found.Count == limit)
                {
                    more = true;
                    break;
                }
                found.Add(e);
            }
            var names = await NamesAsync(found.Select(e => e.UserId).Concat(found.Where(e => e.EntityType == "user").Select(e => e.EntityId)), cancellationToken).ConfigureAwait(false);
            var references = found.Where(e => e.EntityType == "proposal").Select(e => e.EntityId).Distinct().ToList();
            var titles = await db.Proposals.Where(p => references.Contains(p.Reference))
                .ToDictionaryAsync(p => p.Reference, p => p.Title, cancellationToken).ConfigureAwait(false);
            var cycleIds = found.Where(e => e.EntityType == "budget_cycle").Select(e => int.TryParse(e.EntityId, CultureInfo.InvariantCulture, out int id) ? id : 0).Distinct().ToList();
            var cycles = await db.BudgetCycles.Where(c => cycleIds.Contains(c.Id))
                .ToDictionaryAsync(c => c.Id.ToString(CultureInfo.InvariantCulture), c => c.Name, cancellationToken).ConfigureAwait(false);
            var rows = found.Select(e => new AuditRow(e.Id, e.At, e.UserId, names.GetValueOrDefault(e.UserId, e.UserId), e.Action,
                ItemOf(e, names, titles, cycles), e.EntityType == "proposal" ? e.EntityId : null, e.Before, e.After, e.Hash)).ToList();
            return new AuditSearchResult(rows, more);
        }, cancellationToken);
    }

    private static string ItemOf(AuditEvent e, Dictionary<string, string> names, Dictionary<string, string> titles, Dictionary<string, string> cycles) => e.EntityType switch
    {
        "proposal" => titles.TryGetValue(e.EntityId, out string? title) ? $"{e.EntityId} {title}" : e.EntityId,
        "budget_cycle" => cycles.TryGetValue(e.EntityId, out string? name) ? $"Cycle {name}" : $"Cycle {e.EntityId}",
        "marr_policy" => $"MARR version {e.EntityId}",
        "user" => $"Account of {names.GetValueOrDefault(e.EntityId, e.EntityId)}",
        "approval_packet" => $"Approval packet {e.EntityId}",
        "audit_event" => $"Audit event {e.EntityId}",
        _ => $"{e.EntityType} {e.EntityId}",
    };

    private async Task<Dictionary<string, string>> NamesAsync(IEnumerable<string> userIds, CancellationToken cancellationToken)
    {
        var names = new Dictionary<string, string>(StringComparer.Ordinal) { ["capreview"] = "CapReview" };
        foreach (string id in userIds.Distinct(StringComparer.Ordinal).Where(id => !names.ContainsKey(id)))
        {
            KnownPerson? person = await people.FindAsync(id, cancellationToken).ConfigureAwait(false);
            if (person is not null)
            {
                names[id] = person.Name;
            }
        }
        return names;
    }
}
