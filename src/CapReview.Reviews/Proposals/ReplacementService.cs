using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Marr;

namespace CapReview.Reviews.Proposals;

/// <summary>A replacement proposal's keep-or-replace advice, with the version, MARR and first cost it rests on.</summary>
/// <param name="Proposal">The proposal.</param>
/// <param name="Version">The version whose estimates were used: the latest submitted one, else the draft.</param>
/// <param name="Marr">The MARR the annual costs are computed at.</param>
/// <param name="MarrSource">Where that MARR comes from, in words.</param>
/// <param name="ChallengerFirstCost">The challenger's first cost, from the proposal's model.</param>
/// <param name="Advice">Both service lives and the recommendation.</param>
public sealed record ReplacementReview(ProposalView Proposal, VersionView Version, AnnualRate Marr, string MarrSource, double ChallengerFirstCost, ReplacementAdvice Advice);

/// <summary>
/// Keep or replace: the defender's and the challenger's economic service lives at the proposal's MARR (its cycle's
/// policy for its risk class, the newest policy before it is submitted, or its documented override).
/// </summary>
public sealed class ReplacementService(ProposalService proposals, CycleService cycles, MarrPolicyService policies)
{
    /// <summary>The advice on the latest submitted version, else the draft.</summary>
    public Task<ReplacementReview> AdviseAsync(Actor actor, int proposalId, CancellationToken cancellationToken) =>
        AdviseAsync(actor, proposalId, null, cancellationToken);

    /// <summary>The advice on version <paramref name="versionNumber"/> (null: the latest submitted, else the draft).</summary>
    public async Task<ReplacementReview> AdviseAsync(Actor actor, int proposalId, int? versionNumber, CancellationToken cancellationToken)
    {
        ProposalView proposal = await proposals.GetAsync(actor, proposalId, cancellationToken).ConfigureAwait(false);
        VersionView version = versionNumber is int number ? proposal.Version(number) : proposal.Versions.LastOrDefault(v => v.IsFrozen) ?? proposal.Latest;
        ReplacementEstimates estimates = version.Assumptions.Replacement
            ?? throw new RuleViolationException($"Version {version.Number} of {proposal.Reference} has no estimates of the asset it replaces.");

        MarrPolicyVersion? policy;
        string source;
        if (proposal.BudgetCycleId is int cycleId)
        {
            (BudgetCycle cycle, policy) = await cycles.GetAsync(cycleId, cancellationToken).ConfigureAwait(false);
            source = $"the MARR of {cycle.Name} (policy version {policy.Number}) for risk class {proposal.RiskClass}";
        }
        else
        {
            policy = (await policies.ListAsync(cancellationToken).ConfigureAwait(false)).MaxBy(p => p.Number);
            source = policy is null ? "" : $"the newest MARR policy (version {policy.Number}) for risk class {proposal.RiskClass}";
        }
        AnnualRate marr = ProposalTerms.QuotedMarr(version.Assumptions, policy, proposal.RiskClass);
        if (version.Assumptions.MarrOverride is { } own)
        {
            source = $"the proposal's own MARR ({own.Reason})";
        }

        var read = SpecificationReader.Read(version.Assumptions.Model with { Rate = new RateSpec { Value = marr.EffectiveAnnual(), Basis = RateBasis.Effective } });
        if (!read.IsValid)
        {
            var error = read.Errors[0];
            throw new RuleViolationException($"The model is not complete: {Display.FieldWording.Message(error)}");
        }
        double firstCost = Math.Max(0.0, -read.Value!.Model.NetFlows[0]);
        var advice = ReplacementStudy.Advise(estimates.DefenderValueNow, estimates.Defender, firstCost, estimates.Challenger, marr.EffectiveAnnual());
        return new ReplacementReview(proposal, version, marr, source, firstCost, advice);
    }
}
