using CapReview.Packets.Layout;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Portfolio;

namespace CapReview.Packets.Content;

/// <summary>The cycle cover's ranking of the approved proposals and the funded portfolio against the capital limit.</summary>
internal static class CycleSections
{
    public static void RankingAndPortfolio(PageFlow flow, PortfolioResult portfolio, CyclePacketData data, PacketFormat f)
    {
        CycleRanking ranking = portfolio.Ranking;
        flow.Heading("Ranking of the approved proposals", PacketStyle.Heading1);
        flow.Text($"By {ranking.Basis}, each at its MARR.", PacketStyle.Small, PacketStyle.SoftBrush);
        flow.Gap(2);
        TableWriter.Draw(flow,
        [
            new("Rank", 0.6, true), new("Proposal", 3.2), new("AW a year", 1.2, true), new("PW", 1.2, true), new("Rate of return", 1.1, true),
            new("First cost", 1.2, true), new("Life, years", 0.8, true),
        ],
            ranking.Rows.Select(r => new TableRow(
            [
                r.Ranked.Rank.ToString(f.Culture), $"{r.Proposal.Reference} {r.Proposal.Title}", f.Money(r.Ranked.AnnualWorth), f.Money(r.Ranked.PresentWorth),
                f.RateOfReturn(r.Ranked.Evaluation),
                f.Money(r.Ranked.FirstCost), f.Number(r.Ranked.LifeYears, 1),
            ])));

        if (portfolio.LeftOut.Count > 0)
        {
            // One proposal that cannot be evaluated is named here with its reason; it never keeps the others out.
            flow.Gap(2);
            flow.Text("Not in the ranking or the selection:", PacketStyle.BodyBold);
            TableWriter.Draw(flow, [new("Proposal", 3.2), new("Why", 5.0)],
                portfolio.LeftOut.Select(u => new TableRow([$"{u.Proposal.Reference} {u.Proposal.Title}", u.Reason])));
        }

        var approved = data.Decided.Where(d => d.Decision.Outcome == DecisionOutcome.Approve).Select(d => d.Proposal.Reference).ToHashSet();
        var funded = ranking.Rows.Where(r => approved.Contains(r.Proposal.Reference)).ToList();
        double cost = funded.Sum(r => r.Ranked.FirstCost);
        // The alternatives of a group on their chain over the common horizon, as the selection and the incremental analysis compare them.
        SelectionWorths fair = SelectionWorths.Of(ranking, SelectionObjective.PresentWorth);
        flow.Heading("The funded portfolio", PacketStyle.Heading1, keepWith: 80);
        flow.Pairs(
        [
            ("Approved", $"{funded.Count} proposals, first cost {f.Money(cost)} {f.CurrencyCode} of the capital limit of {f.Money(data.Cycle.CapitalLimit)} {f.CurrencyCode}" +
                (cost > (double)data.Cycle.CapitalLimit ? " (above the limit)" : "")),
            ("Total present worth", $"{f.Money(funded.Sum(r => fair.Worth[r.Proposal.Reference]))} {f.CurrencyCode}"),
            ("Optimal selection", portfolio.Optimal.Feasible
                ? $"{string.Join(", ", portfolio.Optimal.Chosen)}: total {(portfolio.Objective == SelectionObjective.AnnualWorth ? "annual" : "present")} worth {f.Money(portfolio.Optimal.TotalWorth)} {f.CurrencyCode}, first cost {f.Money(portfolio.Optimal.TotalCost)}{(portfolio.Optimal.ProvenOptimal ? ", proven optimal" : ", not proven optimal")}"
                : "no set of the approved proposals meets the cycle's rules"),
            ("Basis of the selection", portfolio.WorthBasis),
            ("Greedy fill by ranking", $"{string.Join(", ", portfolio.Greedy.Chosen)}: {f.Money(portfolio.Greedy.TotalWorth)} {f.CurrencyCode}, " +
                (Math.Abs(portfolio.Advantage) < 0.5 ? "the same as the optimal selection" : $"{f.Money(portfolio.Advantage)} less than the optimal selection")),
        ]);
        flow.Text("The optimal selection is the constraint solver's choice among the approved proposals within the capital limits, exclusive groups and contingencies; the board's decisions are the record.", PacketStyle.Small, PacketStyle.SoftBrush);
        flow.Gap(6);
    }
}
