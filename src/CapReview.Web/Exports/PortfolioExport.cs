using System.Globalization;
using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Exports;

/// <summary>The funded portfolio as an export table: every candidate, whether the optimal set and the greedy fill fund it.</summary>
public static class PortfolioExport
{
    public static ExportTable Table(PortfolioResult result, string currency)
    {
        ArgumentNullException.ThrowIfNull(result);
        int laterYears = result.Problem.LaterYearLimits?.Count ?? 0;
        string worth = result.Objective == SelectionObjective.AnnualWorth ? "Annual worth per year" : "Present worth";
        var columns = new List<ExportColumn>
        {
            new("Rank", ExportKind.Whole), new("Reference", ExportKind.Text), new("Title", ExportKind.Text),
            new($"{worth} ({currency})", ExportKind.Money), new($"First cost ({currency})", ExportKind.Money),
        };
        columns.AddRange(Enumerable.Range(1, laterYears).Select(y => new ExportColumn($"Capital in budget year {y} ({currency})", ExportKind.Money)));
        columns.AddRange([new("Optimal selection", ExportKind.Text), new("Greedy fill", ExportKind.Text), new("Exclusive group", ExportKind.Text), new("Needs", ExportKind.Text)]);

        var optimal = result.Optimal.Chosen.ToHashSet();
        var greedy = result.Greedy.Chosen.ToHashSet();
        var byReference = result.Ranking.Rows.ToDictionary(r => r.Proposal.Reference);
        var rows = result.Problem.Candidates.Select(c =>
        {
            RankingRow row = byReference[c.Id];
            var values = new List<object?> { row.Ranked.Rank, c.Id, row.Proposal.Title, c.Worth, c.FirstCost };
            values.AddRange(Enumerable.Range(1, laterYears).Select(y => (object?)c.CapitalIn(y)));
            values.AddRange([optimal.Contains(c.Id) ? "funded" : "", greedy.Contains(c.Id) ? "funded" : "",
                row.Group?.Name, row.Prerequisites.Count == 0 ? null : string.Join(" ", row.Prerequisites)]);
            return (IReadOnlyList<object?>)values;
        }).ToList();
        // Every proposal left out of the selection (one that could not be ranked among them) is a row too, its reason
        // in the optimal selection's column.
        rows.AddRange(result.LeftOut.Select(u =>
        {
            var values = new List<object?> { null, u.Proposal.Reference, u.Proposal.Title, null, null };
            values.AddRange(Enumerable.Range(1, laterYears).Select(_ => (object?)null));
            values.AddRange(["left out: " + u.Reason, "", null, null]);
            return (IReadOnlyList<object?>)values;
        }));

        var notes = new List<string>(RankingExport.Notes(result.Ranking))
        {
            string.Create(CultureInfo.InvariantCulture, $"Maximising total {worth.ToLowerInvariant()} within a capital limit of {result.Problem.CapitalLimit:0.00} {currency} now") +
                (laterYears == 0 ? "." : ", and in later budget years " + string.Join(", ", result.Problem.LaterYearLimits!.Select(l => l.ToString("0.00", CultureInfo.InvariantCulture))) + "."),
            $"Worth compared on one basis for unequal lives: {result.WorthBasis}.",
            string.Create(CultureInfo.InvariantCulture,
                $"Optimal selection: total worth {result.Optimal.TotalWorth:0.00}, first cost {result.Optimal.TotalCost:0.00}, {(result.Optimal.ProvenOptimal ? "proven optimal" : "best found within the time limit, not proven optimal")}."),
            string.Create(CultureInfo.InvariantCulture, $"Greedy fill by ranking: total worth {result.Greedy.TotalWorth:0.00}; the optimal selection is worth {result.Advantage:0.00} more."),
        };
        notes.AddRange(result.LeftOut.Select(e => $"{e.Proposal.Reference} left out: {e.Reason}."));
        return new ExportTable($"Portfolio {result.Ranking.Cycle.Name}", notes, columns, rows);
    }
}
