using CapReview.Engine.Evaluation;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Common;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;

namespace CapReview.Web.Exports;

/// <summary>
/// One version of a proposal as export tables: its measures at the board's MARR, its elements in the import's
/// per-element shape and its flows in the per-period shape (so either sheet can be imported again), the discounting
/// period by period, and, on an after-tax basis, the depreciation schedule and the after-tax flows.
/// </summary>
public static class VersionExport
{
    /// <summary>The tables a version gives, by the name its CSV download uses.</summary>
    public static readonly IReadOnlyList<string> Names = ["summary", "elements", "cash-flows", "discounting", "depreciation", "after-tax"];

    public static IReadOnlyList<(string Name, ExportTable Table)> Tables(ProposalView proposal, VersionView version, MarrPolicyVersion policy, string currency)
    {
        ArgumentNullException.ThrowIfNull(proposal);
        ArgumentNullException.ThrowIfNull(version);
        ArgumentNullException.ThrowIfNull(policy);
        var notes = new List<string>
        {
            $"{proposal.Reference} {proposal.Title}, version {version.Number} ({(version.IsFrozen ? "submitted" : "draft")}); assumptions SHA-256 {version.AssumptionsHash}.",
            $"MARR policy version {policy.Number} (SHA-256 {MarrPolicyDocument.Hash(policy)}); money in {currency}; rates as fractions a year, effective.",
            Cautions.Estimates,
        };
        // The same figures the version's packet states (VersionFigures); the export only lays them out.
        VersionFigures figures = VersionFigures.Of(proposal, version, policy, studyPeriodYears: null, simulate: false);
        Evaluation? evaluation = figures.Evaluation;
        var tables = new List<(string, ExportTable)>
        {
            ("summary", Summary(proposal, version, evaluation, notes)),
            ("elements", Elements(version.Assumptions.Model, notes)),
        };
        if (evaluation is not null)
        {
            tables.Add(("cash-flows", CashFlows(evaluation, version.Assumptions.Model, notes)));
            tables.Add(("discounting", Discounting(figures.Periods, notes)));
        }
        if (figures.AfterTax?.Value is { } afterTax && figures.Depreciation is { } schedule)
        {
            tables.Add(("depreciation", Depreciation(afterTax, schedule, notes)));
            tables.Add(("after-tax", AfterTax(afterTax, notes)));
        }
        return tables;
    }

    private static ExportTable Summary(ProposalView proposal, VersionView version, Evaluation? e, IReadOnlyList<string> notes)
    {
        var rows = new List<IReadOnlyList<object?>>
        {
            Row("Reference", proposal.Reference), Row("Title", proposal.Title), Row("Category", Reviews.Display.EnumWording.Of(proposal.Category)),
            Row("Risk class", Reviews.Display.EnumWording.Of(proposal.RiskClass)), Row("Version", version.Number), Row("Reason", version.Reason),
            Row("Assumptions SHA-256", version.AssumptionsHash),
        };
        if (e is null)
        {
            rows.Add(Row("Measures", "The model of this version is not complete, so no measure can be stated."));
        }
        else
        {
            rows.AddRange(
            [
                Row("MARR (a year, effective)", e.Marr.EffectiveAnnual()), Row("Horizon (periods)", e.Model.Horizon), Row("Periods a year", e.Model.PeriodsPerYear),
                Row("Present worth", e.PresentWorth), Row("Annual worth (a year)", e.AnnualWorth), Row("Future worth", e.FutureWorth),
                Row("Rate of return (a year)", e.UniqueRateOfReturn),
                Row("Rates of return found", e.RatesOfReturn.Count),
                Row("External rate of return (a year)", e.ExternalRate), Row("Simple payback (years)", e.SimplePaybackYears),
                Row("Discounted payback (years)", e.DiscountedPaybackYears), Row("Benefit-cost ratio", e.BenefitCost.Conventional),
                Row("Modified benefit-cost ratio", e.BenefitCost.Modified),
            ]);
        }
        return new ExportTable("Summary", notes, [new("Item", ExportKind.Text), new("Value", ExportKind.Number)], rows);

        static IReadOnlyList<object?> Row(string item, object? value) => [item, value];
    }

    /// <summary>The elements in the per-element import shape, with the same column names.</summary>
    private static ExportTable Elements(ModelSpec model, IReadOnlyList<string> notes) => new("Elements", notes,
        [
            new("type", ExportKind.Text), new("label", ExportKind.Text), new("category", ExportKind.Text), new("amount", ExportKind.Money),
            new("period", ExportKind.Whole), new("first", ExportKind.Whole), new("last", ExportKind.Whole), new("every", ExportKind.Whole),
            new("step", ExportKind.Money), new("growth", ExportKind.Percent), new("money", ExportKind.Text), new("escalation", ExportKind.Percent),
            new("expensed", ExportKind.Text),
        ],
        [.. (model.Elements ?? []).OfType<ElementSpec>().Select(e => (IReadOnlyList<object?>)
        [
            e.Type?.ToString().ToLowerInvariant(), e.Label, e.Category?.ToString().ToLowerInvariant(), e.Amount, e.Period, e.First, e.Last, e.Every,
            e.Step, e.Growth, e.Money?.ToString().ToLowerInvariant(), e.Escalation, e.Expensed == true ? "yes" : null,
        ])]);

    /// <summary>Each element's flow in each period (in actual money), in the per-period import shape.</summary>
    private static ExportTable CashFlows(Evaluation e, ModelSpec model, IReadOnlyList<string> notes)
    {
        var elements = e.Model.Elements;
        var flows = Enumerable.Range(0, elements.Count).Select(e.Model.FlowsOf).ToList();
        return new ExportTable("Cash flows", notes,
            [new("period", ExportKind.Whole), .. elements.Select(x => new ExportColumn($"{x.Label} [{x.Category.ToString().ToLowerInvariant()}]", ExportKind.Money))],
            [.. Enumerable.Range(0, e.Model.Horizon + 1).Select(t => (IReadOnlyList<object?>)[t, .. flows.Select(f => (object?)f[t])])]);
    }

    private static ExportTable Discounting(IReadOnlyList<PeriodRow> periods, IReadOnlyList<string> notes) => new("Discounting", notes,
        [new("Period", ExportKind.Whole), new("Net flow", ExportKind.Money), new("(P/F, i, t)", ExportKind.Number), new("Present worth of the flow", ExportKind.Money), new("Cumulative present worth", ExportKind.Money)],
        [.. periods.Select(r => (IReadOnlyList<object?>)[r.Period, r.Net, r.Factor, r.PresentWorth, r.CumulativePresentWorth])]);

    private static ExportTable Depreciation(AfterTaxEvaluation r, Engine.Depreciation.DepreciationSchedule schedule, IReadOnlyList<string> notes)
    {
        return new ExportTable("Depreciation", [$"{r.Settings.Depreciation.Method}.", .. notes],
            [new("Tax year", ExportKind.Whole), new("Depreciation", ExportKind.Money), new("Share of basis", ExportKind.Percent), new("Book value at year end", ExportKind.Money)],
            [.. schedule.Amounts.Select((a, k) => (IReadOnlyList<object?>)[k + 1, a, schedule.Basis == 0 ? 0.0 : a / schedule.Basis, schedule.BookValueAfter(k + 1)])]);
    }

    private static ExportTable AfterTax(AfterTaxEvaluation r, IReadOnlyList<string> notes) => new("After tax",
        [$"After-tax MARR {r.AfterTax.Marr.EffectiveAnnual():0.####}: {r.AfterTaxMarrBasis}; after-tax present worth {r.AfterTax.PresentWorth:0.##}.", .. notes],
        [
            new("Year", ExportKind.Whole), new("Before tax", ExportKind.Money), new("Depreciation", ExportKind.Money), new("Taxable income", ExportKind.Money),
            new("Tax", ExportKind.Money), new("Credit", ExportKind.Money), new("After tax", ExportKind.Money), new("Equity", ExportKind.Money),
        ],
        [.. r.Table.Rows.Select(row => (IReadOnlyList<object?>)[row.Period, row.BeforeTax, row.Depreciation, row.TaxableIncome, row.Tax, row.Credit, row.AfterTax, r.Equity is null ? null : row.Equity])]);
}
