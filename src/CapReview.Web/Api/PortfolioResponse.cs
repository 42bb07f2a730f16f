using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Api;

/// <summary>
/// A cycle's funded portfolio for one what-if: the optimal set, the greedy fill by ranking, their difference and the
/// frontier; <c>Basis</c> is the ranking's, <c>WorthBasis</c> the one the candidates' worths are compared on.
/// </summary>
public sealed record PortfolioResponse(int CycleId, string Objective, string Basis, string WorthBasis, bool AfterTax, double MarrShift, double CapitalLimit, IReadOnlyList<double> LaterYearLimits,
    SelectionResponse Optimal, SelectionResponse Greedy, PortfolioDifferenceResponse Difference, IReadOnlyList<PortfolioCandidateResponse> Candidates,
    IReadOnlyList<FrontierPointResponse> Frontier, IReadOnlyList<UnrankedResponse> Excluded)
{
    public static PortfolioResponse From(PortfolioResult r)
    {
        ArgumentNullException.ThrowIfNull(r);
        var optimal = r.Optimal.Chosen.ToHashSet(StringComparer.Ordinal);
        var greedy = r.Greedy.Chosen.ToHashSet(StringComparer.Ordinal);
        var rows = r.Ranking.Rows.ToDictionary(x => x.Proposal.Reference, StringComparer.Ordinal);
        var difference = new PortfolioDifferenceResponse(r.Advantage, r.Optimal.TotalCost - r.Greedy.TotalCost,
            [.. optimal.Except(greedy).Order(StringComparer.Ordinal)], [.. greedy.Except(optimal).Order(StringComparer.Ordinal)]);
        int laterYears = r.Problem.LaterYearLimits?.Count ?? 0;
        return new(r.Ranking.Cycle.Id, r.Objective == SelectionObjective.AnnualWorth ? "annualWorth" : "presentWorth", r.Ranking.Basis, r.WorthBasis, r.Ranking.AfterTax,
            r.Ranking.MarrShift, r.Problem.CapitalLimit, [.. r.Problem.LaterYearLimits ?? []],
            SelectionResponse.From(r.Optimal), SelectionResponse.From(r.Greedy), difference,
            [.. r.Problem.Candidates.Select(c => new PortfolioCandidateResponse(rows[c.Id].Ranked.Rank, rows[c.Id].Proposal.Id, c.Id, rows[c.Id].Proposal.Title, c.Worth, c.FirstCost,
                [.. Enumerable.Range(1, laterYears).Select(c.CapitalIn)], optimal.Contains(c.Id), greedy.Contains(c.Id)))],
            [.. r.Frontier.Select(f => new FrontierPointResponse(f.Limit, f.Selection.TotalWorth, f.Selection.TotalCost, [.. f.Selection.Chosen.Order(StringComparer.Ordinal)], f.Selection.ProvenOptimal))],
            [.. r.LeftOut.Select(e => new UnrankedResponse(e.Proposal.Id, e.Proposal.Reference, e.Reason))]);
    }
}
