using CapReview.Engine.Rates;
using CapReview.Reviews.Access;
using CapReview.Reviews.Audit;
using CapReview.Reviews.Common;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Marr;

/// <summary>
/// The MARR policy: administrators add versions; nothing changes or removes one, so past cycles keep theirs. A version
/// entered by mistake is retired: kept and shown, but never pinned by a new cycle and never the current one.
/// </summary>
public sealed class MarrPolicyService(ReviewWork work, AuditTrail audit, TimeProvider clock)
{
    public Task<MarrPolicyVersion> AddVersionAsync(Actor actor, NewMarrPolicy policy, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        ArgumentNullException.ThrowIfNull(policy);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can set the MARR policy.");
        }
        var errors = MarrBounds.Check(policy.Rate, policy.Basis, policy.CompoundingsPerYear, "rate");
        if (errors.Count > 0)
        {
            throw new RuleViolationException($"{errors[0].Field}: {errors[0].Message}");
        }
        if (new[] { policy.LowRiskPremium, policy.StandardRiskPremium, policy.HighRiskPremium }.Any(p => !double.IsFinite(p) || p < -0.5 || p > 1.0))
        {
            throw new RuleViolationException("A risk premium must lie between -50 and +100 percentage points.");
        }
        // Each risk class's MARR is the base rate's effective annual equivalent plus its premium: it must be a rate
        // too, or every proposal of that class would fail to evaluate once a cycle is pinned to this version.
        double effective = AnnualRate.Create(policy.Rate, policy.Basis, policy.CompoundingsPerYear).EffectiveAnnual();
        foreach (var (field, words, premium) in new[] { ("lowRiskPremium", "low", policy.LowRiskPremium), ("standardRiskPremium", "standard", policy.StandardRiskPremium), ("highRiskPremium", "high", policy.HighRiskPremium) })
        {
            if (premium != 0.0 && !MarrBounds.Allows(effective + premium))
            {
                throw new RuleViolationException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                    $"{field}: with this premium the MARR of {words}-risk proposals would be {(effective + premium) * 100:0.##} %; it must stay between −40 % and 1000 % a year."));
            }
        }
        if (!double.IsFinite(policy.InflationRate) || policy.InflationRate is <= -0.5 or > 1.0)
        {
            throw new RuleViolationException("inflationRate: general inflation must lie between −50 % and 100 % a year.");
        }
        if (policy.AfterTaxRate is double afterTax && (!double.IsFinite(afterTax) || afterTax is <= -0.5 or > 1.0))
        {
            throw new RuleViolationException("afterTaxRate: the after-tax MARR must lie between −50 % and 100 % a year.");
        }
        if (string.IsNullOrWhiteSpace(policy.Reason))
        {
            throw new RuleViolationException("Say why the MARR is set or changed.");
        }
        return work.RunAsync(async db =>
        {
            int number = (await db.MarrPolicyVersions.MaxAsync(m => (int?)m.Number, cancellationToken).ConfigureAwait(false) ?? 0) + 1;
            var version = new MarrPolicyVersion(number, policy with { Reason = policy.Reason.Trim() }, actor.UserId, clock.GetUtcNow());
            db.MarrPolicyVersions.Add(version);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "marr.version-added", "marr_policy", number.ToString(System.Globalization.CultureInfo.InvariantCulture), null, policy, cancellationToken).ConfigureAwait(false);
            return version;
        }, cancellationToken);
    }

    /// <summary>Retires a version entered by mistake, with the reason; cycles already pinned to it keep it.</summary>
    public Task<MarrVersionRetirement> RetireAsync(Actor actor, int versionId, string reason, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!actor.Has(Role.Administrator))
        {
            throw new AccessDeniedException("Only an administrator can retire a MARR version.");
        }
        if (string.IsNullOrWhiteSpace(reason) || reason.Trim().Length > 1000)
        {
            throw new RuleViolationException("reason: say in at most 1,000 characters why the version is retired.");
        }
        return work.RunAsync(async db =>
        {
            MarrPolicyVersion version = await db.MarrPolicyVersions.SingleOrDefaultAsync(m => m.Id == versionId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such MARR policy version.");
            if (await db.MarrVersionRetirements.AnyAsync(r => r.MarrPolicyVersionId == versionId, cancellationToken).ConfigureAwait(false))
            {
                throw new RuleViolationException($"MARR version {version.Number} is already retired.");
            }
            var retirement = new MarrVersionRetirement(versionId, reason.Trim(), actor.UserId, clock.GetUtcNow());
            db.MarrVersionRetirements.Add(retirement);
            await db.SaveChangesAsync(cancellationToken).ConfigureAwait(false);
            await audit.AppendAsync(db, actor, "marr.version-retired", "marr_policy", version.Number.ToString(System.Globalization.CultureInfo.InvariantCulture),
                null, new { Version = version.Number, Reason = retirement.Reason }, cancellationToken).ConfigureAwait(false);
            return retirement;
        }, cancellationToken);
    }

    /// <summary>The retirements, by the id of the version each retires.</summary>
    public Task<IReadOnlyDictionary<int, MarrVersionRetirement>> RetirementsAsync(CancellationToken cancellationToken) =>
        work.ReadAsync<IReadOnlyDictionary<int, MarrVersionRetirement>>(async db =>
            await db.MarrVersionRetirements.AsNoTracking().ToDictionaryAsync(r => r.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false), cancellationToken);

    /// <summary>The newest version not retired: what a new cycle is offered first and what a new version starts from; null when there is none.</summary>
    public Task<MarrPolicyVersion?> CurrentAsync(CancellationToken cancellationToken) =>
        work.ReadAsync(db => db.MarrPolicyVersions.AsNoTracking()
            .Where(m => !db.MarrVersionRetirements.Any(r => r.MarrPolicyVersionId == m.Id))
            .OrderByDescending(m => m.Number).FirstOrDefaultAsync(cancellationToken), cancellationToken);

    /// <summary>One version, retired or not; null when there is none with that id.</summary>
    public Task<MarrPolicyVersion?> FindAsync(int id, CancellationToken cancellationToken) =>
        work.ReadAsync(db => db.MarrPolicyVersions.AsNoTracking().SingleOrDefaultAsync(m => m.Id == id, cancellationToken), cancellationToken);

    public Task<IReadOnlyList<MarrPolicyVersion>> ListAsync(CancellationToken cancellationToken) =>
        work.ReadAsync<IReadOnlyList<MarrPolicyVersion>>(async db =>
            await db.MarrPolicyVersions.OrderBy(m => m.Number).ToListAsync(cancellationToken).ConfigureAwait(false), cancellationToken);
}

/// <summary>A new MARR policy version as an administrator enters it.</summary>
public sealed record NewMarrPolicy(
    double Rate,
    RateBasis Basis,
    int CompoundingsPerYear,
    DateOnly EffectiveFrom,
    string Reason,
    double LowRiskPremium = 0.0,
    double StandardRiskPremium = 0.0,
    double HighRiskPremium = 0.0,
    double InflationRate = 0.0,
    bool RealMarr = false,
    double? AfterTaxRate = null);
