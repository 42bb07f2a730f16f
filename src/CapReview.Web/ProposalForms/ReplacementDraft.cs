using System.Globalization;
using CapReview.Engine.Comparison;
using CapReview.Reviews.Proposals;

namespace CapReview.Web.ProposalForms;

/// <summary>One year of estimates as typed: the market value at the end of the year and the operating cost in it.</summary>
public sealed class ServiceYearDraft
{
    public string MarketValue { get; set; } = "";

    public string OperatingCost { get; set; } = "";
}

/// <summary>
/// The replacement estimates as a lead types them, in the organisation's culture: the defender's market value now and
/// year-by-year values and costs of the defender and the challenger.
/// </summary>
public sealed class ReplacementDraft
{
    public string DefenderValueNow { get; set; } = "";

    public List<ServiceYearDraft> Defender { get; } = [];

    public List<ServiceYearDraft> Challenger { get; } = [];

    /// <summary>Nothing entered: the proposal carries no replacement estimates.</summary>
    public bool IsEmpty => DefenderValueNow.Trim().Length == 0 && Defender.Count == 0 && Challenger.Count == 0;

    public static ReplacementDraft From(ReplacementEstimates? estimates, CultureInfo culture)
    {
        var draft = new ReplacementDraft();
        if (estimates is null)
        {
            return draft;
        }
        draft.DefenderValueNow = Text(estimates.DefenderValueNow, culture);
        draft.Defender.AddRange(estimates.Defender.Select(y => new ServiceYearDraft { MarketValue = Text(y.MarketValue, culture), OperatingCost = Text(y.OperatingCost, culture) }));
        draft.Challenger.AddRange(estimates.Challenger.Select(y => new ServiceYearDraft { MarketValue = Text(y.MarketValue, culture), OperatingCost = Text(y.OperatingCost, culture) }));
        return draft;
    }

    /// <summary>The estimates, null when nothing was entered, or the first cell that is not a number, by field path.</summary>
    public (ReplacementEstimates? Estimates, string? Error) Read(CultureInfo culture)
    {
        if (IsEmpty)
        {
            return (null, null);
        }
        if (!TryNumber(DefenderValueNow, culture, out double now))
        {
            return (null, "replacement.defenderValueNow: the defender's market value now is not a number.");
        }
        var lists = new List<List<ServiceYear>>();
        foreach (var (name, rows) in new[] { ("defender", Defender), ("challenger", Challenger) })
        {
            var years = new List<ServiceYear>();
            for (int k = 0; k < rows.Count; k++)
            {
                if (!TryNumber(rows[k].MarketValue, culture, out double value))
                {
                    return (null, $"replacement.{name}[{k}].marketValue: year {k + 1}'s market value is not a number.");
                }
                if (!TryNumber(rows[k].OperatingCost, culture, out double cost))
                {
                    return (null, $"replacement.{name}[{k}].operatingCost: year {k + 1}'s operating cost is not a number.");
                }
                years.Add(new ServiceYear(value, cost));
            }
            lists.Add(years);
        }
        return (new ReplacementEstimates(now, lists[0], lists[1]), null);
    }

    private static bool TryNumber(string text, CultureInfo culture, out double value) =>
        double.TryParse(text.Trim(), NumberStyles.Number, culture, out value) && double.IsFinite(value);

    private static string Text(double value, CultureInfo culture) => value.ToString("0.############", culture);
}
