using CapReview.Engine.Comparison;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Common;
using CapReview.Reviews.Cycles;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Storage;
using Microsoft.EntityFrameworkCore;

namespace CapReview.Reviews.Portfolio;

/// <summary>
/// Ranks a cycle's proposals under review or approved, each on its latest frozen version at its MARR, by annual worth
/// on the cycle's basis. For the board, finance and administrators.
/// </summary>
public sealed class CycleRankingService(ReviewWork work)
{
    private static readonly ProposalStatus[] Ranked = [ProposalStatus.Submitted, ProposalStatus.InReview, ProposalStatus.Approved];

    /// <summary>
    /// The ranking, with every MARR shifted by <paramref name="marrShift"/> effective annual points for a what-if (0 for
    /// the cycle's own); with <paramref name="afterTax"/>, on the after-tax flows at the after-tax MARR.
    /// </summary>
    public async Task<CycleRanking> RankAsync(Actor actor, int cycleId, double marrShift, CancellationToken cancellationToken, bool afterTax = false)
    {
        CheckShift(marrShift);
        CycleRankingInputs inputs = await LoadAsync(actor, cycleId, cancellationToken).ConfigureAwait(false);
        return Rank(inputs, marrShift, afterTax);
    }

    /// <summary>
    /// What the cycle's ranking is computed from, in one read; for the board and administrators, and for finance once
    /// the cycle is decided (<see cref="ProposalAccess.CanSeeProposalsOf"/>).
    /// </summary>
    public Task<CycleRankingInputs> LoadAsync(Actor actor, int cycleId, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(actor);
        if (!(actor.Has(Role.Reviewer) || actor.Has(Role.Finance) || actor.Has(Role.Administrator)))
        {
            throw new AccessDeniedException("Only the review board, finance and administrators see a cycle's ranking.");
        }
        return work.ReadAsync(async db =>
        {
            BudgetCycle cycle = await db.BudgetCycles.SingleOrDefaultAsync(c => c.Id == cycleId, cancellationToken).ConfigureAwait(false)
                ?? throw new NotFoundException("There is no such budget cycle.");
            // Every face (the pages, the API, the downloads) reads a cycle's proposals through here, so the rule holds for all.
            ProposalAccess.RequireProposalsOf(actor, cycle, "the ranking and portfolio");
            var marr = await db.MarrPolicyVersions.SingleAsync(m => m.Id == cycle.MarrPolicyVersionId, cancellationToken).ConfigureAwait(false);
            var proposals = await db.Proposals.Include(p => p.Versions)
                .Where(p => p.BudgetCycleId == cycleId && Ranked.Contains(p.Status))
                .OrderBy(p => p.Id).ToListAsync(cancellationToken).ConfigureAwait(false);
            PortfolioRules rules = await PortfolioRulesService.LoadAsync(db, cycleId, cancellationToken).ConfigureAwait(false);
            return new CycleRankingInputs(cycle, marr, [.. proposals.Select(ProposalView.Of)], rules);
        }, cancellationToken);
    }

    /// <summary>The ranking computed from inputs already read (see <see cref="RankAsync"/>); reads nothing.</summary>
    public static CycleRanking Rank(CycleRankingInputs inputs, double marrShift, bool afterTax)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        CheckShift(marrShift);
        return Rank(inputs.Cycle, inputs.Marr, inputs.Proposals, inputs.Rules, marrShift, afterTax);
    }

    private static void CheckShift(double marrShift)
    {
        if (!double.IsFinite(marrShift) || Math.Abs(marrShift) > 0.5)
        {
            throw new RuleViolationException("marrShift: shift the MARR by at most 50 points either way.");
        }
    }

    internal static CycleRanking Rank(BudgetCycle cycle, Marr.MarrPolicyVersion marr, IReadOnlyList<ProposalView> proposals, PortfolioRules rules, double marrShift, bool afterTax)
    {
        var entries = new List<RankingEntry>();
        var sources = new Dictionary<string, (ProposalView Proposal, VersionView Version)>(StringComparer.Ordinal);
        var unranked = new List<UnrankedProposal>();
        foreach (ProposalView proposal in proposals)
        {
            VersionView? version = proposal.Versions.LastOrDefault(v => v.IsFrozen);
            if (version is null)
            {
                unranked.Add(new(proposal, "no submitted version"));
                continue;
            }
            ModelSpec model = ProposalTerms.Model(version.Assumptions, marr, proposal.RiskClass);
            if (afterTax)
            {
                if (ProposalTerms.Tax(version.Assumptions, marr) is not { } tax)
                {
                    unranked.Add(new(proposal, "it has no tax settings, so it has no after-tax figures"));
                    continue;
                }
                var evaluated = AfterTaxEvaluator.Evaluate(model, tax);
                if (!evaluated.IsValid)
                {
                    var error = evaluated.Errors[0];
                    unranked.Add(new(proposal, $"its after-tax figures cannot be computed: {error.Field}: {error.Message}"));
                    continue;
                }
                // The after-tax flows ranked as a model of their own; their value at a study period's end is not taxed again.
                entries.Add(new RankingEntry(proposal.Reference, evaluated.Value!.AfterTax.Model, evaluated.Value.AfterTax.Marr, version.Assumptions.ValueAtStudyEnd,
                    CapitalFrom: evaluated.Value.BeforeTax.Model));
            }
            else
            {
                var read = SpecificationReader.Read(model);
                if (!read.IsValid)
                {
                    var error = read.Errors[0];
                    unranked.Add(new(proposal, $"the model cannot be evaluated: {error.Field}: {error.Message}"));
                    continue;
                }
                entries.Add(new RankingEntry(proposal.Reference, read.Value!.Model, read.Value.Options.Marr, version.Assumptions.ValueAtStudyEnd));
            }
            sources[proposal.Reference] = (proposal, version);
        }
        var byId = proposals.ToDictionary(p => p.Id);
        // A proposal whose worth cannot be computed on the cycle's basis (a stored MARR past the bounds, a what-if
        // shift that takes it there) is listed as not ranked with the reason; it never takes the cycle's ranking down.
        RankingOutcome outcome = ProposalRanking.RankEvaluable(entries, cycle.StudyPeriodYears, marrShift);
        unranked.AddRange(outcome.Unevaluable.Select(u => new UnrankedProposal(sources[u.Id].Proposal, "its worth cannot be computed: " + u.Reason)));
        var rows = outcome.Ranked.Select(ranked =>
        {
            var (proposal, version) = sources[ranked.Id];
            var prerequisites = rules.PrerequisitesOf(proposal.Id)
                .Select(id => byId.TryGetValue(id, out var p) ? p.Reference : $"#{id}").ToList();
            return new RankingRow(proposal, version, ranked.Evaluation.Marr, ranked, rules.GroupOf(proposal.Id), prerequisites);
        }).ToList();
        return new CycleRanking(cycle, marr, marrShift, rows, unranked, rules) { AfterTax = afterTax };
    }
}
