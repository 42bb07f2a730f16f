using CapReview.Reviews.Common;
using CapReview.Reviews.Portfolio;

namespace CapReview.Web.Exports;

/// <summary>A cycle's ranking as an export table: one row per ranked proposal with every measure.</summary>
public static class RankingExport
{
    public static ExportTable Table(CycleRanking ranking, string currency)
    {
        ArgumentNullException.ThrowIfNull(ranking);
        ExportColumn[] columns =
        [
            new("Rank", ExportKind.Whole), new("Reference", ExportKind.Text), new("Title", ExportKind.Text), new("Version", ExportKind.Whole),
            new("Category", ExportKind.Text), new("Risk class", ExportKind.Text), new("MARR", ExportKind.Percent),
            new($"Annual worth per year ({currency})", ExportKind.Money), new($"Present worth ({currency})", ExportKind.Money),
            new("Rate of return", ExportKind.Percent), new("Rate of return note", ExportKind.Text), new("External rate of return", ExportKind.Percent),
            new("Discounted payback (years)", ExportKind.Number), new("Benefit-cost ratio", ExportKind.Number),
            new($"First cost ({currency})", ExportKind.Money), new("Life (years)", ExportKind.Number), new("Basis", ExportKind.Text),
            new("Exclusive group", ExportKind.Text), new("Needs", ExportKind.Text), new("Assumptions SHA-256", ExportKind.Text),
        ];
        var rows = ranking.Rows.Select(r => (IReadOnlyList<object?>)
        [
            r.Ranked.Rank, r.Proposal.Reference, r.Proposal.Title, r.Version.Number, Reviews.Display.EnumWording.Of(r.Proposal.Category), Reviews.Display.EnumWording.Of(r.Proposal.RiskClass),
            r.Marr.EffectiveAnnual(), r.Ranked.AnnualWorth, r.Ranked.PresentWorth,
            r.Ranked.Evaluation.UniqueRateOfReturn, RateNote(r.Ranked.Evaluation.RatesOfReturn.Count), r.Ranked.Evaluation.ExternalRate,
            r.Ranked.Evaluation.DiscountedPaybackYears, r.Ranked.Evaluation.BenefitCost.Conventional,
            r.Ranked.FirstCost, r.Ranked.LifeYears, r.Ranked.Basis,
            r.Group is null ? null : r.Group.Name + (r.Group.Mandatory ? " (mandatory)" : ""),
            r.Prerequisites.Count == 0 ? null : string.Join(" ", r.Prerequisites), r.Version.AssumptionsHash,
        ]).ToList();
        // A proposal that could not be ranked is listed too, with no figures and the reason in the basis column: the
        // download shows every proposal of the cycle the page shows.
        rows.AddRange(ranking.Unranked.Select(u => (IReadOnlyList<object?>)
        [
            null, u.Proposal.Reference, u.Proposal.Title, u.Proposal.Versions.LastOrDefault(v => v.IsFrozen)?.Number, Reviews.Display.EnumWording.Of(u.Proposal.Category),
            Reviews.Display.EnumWording.Of(u.Proposal.RiskClass), null, null, null, null, null, null, null, null, null, null, NotRanked + u.Reason, null, null,
            u.Proposal.Versions.LastOrDefault(v => v.IsFrozen)?.AssumptionsHash,
        ]));
        return new ExportTable($"Ranking {ranking.Cycle.Name}", Notes(ranking), columns, rows);
    }

    /// <summary>The start of the basis column of a proposal that could not be ranked, before its reason.</summary>
    public const string NotRanked = "not ranked: ";

    internal static IReadOnlyList<string> Notes(CycleRanking ranking) =>
    [
        $"Ranked by {ranking.Basis}; MARR policy version {ranking.Marr.Number}" +
            (ranking.MarrShift == 0 ? "." : $", every MARR shifted by {ranking.MarrShift * 100:+0.##;-0.##} points (a what-if)."),
        "Rates are annual effective; money in the organisation's currency.",
        Cautions.Estimates,
    ];

    private static string RateNote(int roots) => roots switch
    {
        0 => "none",
        1 => "unique",
        _ => "several",
    };
}
