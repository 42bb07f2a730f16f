using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Measures;
using CapReview.Engine.Validation;
using CapReview.Packets.Charts;
using CapReview.Packets.Layout;
using CapReview.Reviews.Common;
using CapReview.Reviews.Decisions;
using CapReview.Reviews.Display;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Risk;
using PdfSharp.Pdf;

namespace CapReview.Packets.Content;

/// <summary>
/// The sections of one proposal's record: the decision and sign-offs, the measures and what they mean, the two charts,
/// the cash flows per period and per element, the version history with its changes, and the cautions.
/// </summary>
internal static class ProposalSections
{
    public static void Write(PageFlow flow, ProposalPacketData data, PacketFormat f, PdfOutline parent)
    {
        VersionView version = data.Version;
        VersionFigures figures = data.Figures;
        Evaluation? evaluation = figures.Evaluation;

        flow.Bookmark("Decision and sign-off", parent);
        flow.Heading("Decision and sign-off", PacketStyle.Heading1);
        flow.Pairs(
        [
            ("Decision", OutcomeText(data.Decision.Outcome)),
            ("Conditions", data.Decision.Conditions.Length == 0 ? "none" : data.Decision.Conditions),
            ("Recorded", f.Time(data.Decision.DecidedAt)),
            ("On version", $"{version.Number}, submitted {(version.FrozenAt is { } at ? f.Time(at) : "–")}"),
            ("Assumptions SHA-256", version.AssumptionsHash),
            ("MARR policy", $"version {data.Marr.Number}, SHA-256 {MarrPolicyDocument.Hash(data.Marr)}"),
        ]);
        flow.Gap(4);
        flow.Text($"The board's sign-offs of the decisions of {data.Cycle.Name} ({data.SignOffs.Count} of {data.Cycle.RequiredSignOffs} required):", PacketStyle.BodyBold);
        flow.Gap(2);
        TableWriter.Draw(flow, [new("Board member", 3), new("Signed off", 2)],
            data.SignOffs.Count == 0 ? [new TableRow(["none yet", ""])] : data.SignOffs.Select(s => new TableRow([s.DisplayName, f.Time(s.SignedAt)])));

        flow.Bookmark("Measures", parent);
        flow.Heading("What the proposal is worth", PacketStyle.Heading1);
        if (evaluation is null)
        {
            flow.Text("No measure of this version can be stated: " + (figures.WhyNoMeasures ?? "its model is not complete."), PacketStyle.Body);
            return;
        }
        Summary(flow, data, evaluation, figures.StudyPeriod, version.Assumptions.MarrOverride?.Reason, f);

        flow.Bookmark("Charts", parent);
        flow.Heading("Cash flows and the present worth profile", PacketStyle.Heading1, keepWith: 240);
        flow.Figure(210, (g, area) => CashFlowDiagramDrawing.Draw(g, area, evaluation.NetFlows, evaluation.Model.PeriodsPerYear, f),
            $"Net cash flow of each period, {f.CurrencyCode}: receipts up, payments down.");
        flow.Figure(210, (g, area) => WorthProfileDrawing.Draw(g, area, figures.Profile, evaluation.RatesOfReturn, evaluation.Marr.EffectiveAnnual(), f),
            "Present worth at each annual rate; the dashed line is the MARR, each diamond a rate of return (where the worth is zero).");

        flow.Bookmark("Cash-flow tables", parent);
        flow.Heading("Cash flows per period", PacketStyle.Heading1);
        PerPeriod(flow, evaluation, figures.Periods, f);
        flow.Heading("Cash flows per element", PacketStyle.Heading1);
        PerElement(flow, evaluation, figures.ElementWorths, version.Assumptions.Model, f);

        if (figures.AfterTax is { } afterTax)
        {
            flow.Bookmark("After tax", parent);
            AfterTax(flow, afterTax, figures.Depreciation, figures.Outlays, f);
        }

        if (figures.Risk is { } study)
        {
            flow.Bookmark("Risk", parent);
            Risk(flow, study, figures.Sensitivity, figures.Simulation, f);
        }

        flow.Bookmark("Version history", parent);
        History(flow, data, figures.Changes, f);
        flow.Note("Cautions", Cautions.Estimates, PacketStyle.Amber);
    }

    internal static string OutcomeText(DecisionOutcome outcome) => outcome switch
    {
        DecisionOutcome.Approve => "Approved",
        DecisionOutcome.Reject => "Rejected",
        _ => "Returned for changes",
    };

    private static void Summary(PageFlow flow, ProposalPacketData data, Evaluation e, RankedProposal? basis, string? overrideReason, PacketFormat f)
    {
        double marr = e.Marr.EffectiveAnnual();
        string marrText = overrideReason is null
            ? $"{f.Percent(marr)} a year effective: policy version {data.Marr.Number} for risk class {data.Proposal.RiskClass}"
            : $"{f.Percent(marr)} a year effective: the proposal's own MARR ({overrideReason})";
        string rate = e.RatesOfReturn.Count switch
        {
            0 => "none: the flows have no rate at which their worth is zero",
            1 => $"{f.Percent(e.RatesOfReturn[0])} a year (unique)",
            _ => $"several: {string.Join(", ", e.RatesOfReturn.Select(f.Percent))}; no single rate describes the proposal",
        };
        flow.Pairs(
        [
            ("MARR", marrText),
            ("Life", $"{f.Number(e.Model.Years, 2)} years ({e.Model.Horizon} periods of {(e.Model.PeriodsPerYear == 1 ? "a year" : $"1/{e.Model.PeriodsPerYear} year")})"),
            ("Basis", basis?.Basis ?? ProposalRanking.Repeatability),
            ("Present worth", $"{f.Money(e.PresentWorth)} {f.CurrencyCode}" + (basis is null ? "" : $" over its life; {f.Money(basis.PresentWorth)} over the study period")),
            ("Annual worth", $"{f.Money(basis?.AnnualWorth ?? e.AnnualWorth)} {f.CurrencyCode} a year"),
            ("Future worth", e.FutureWorth is double fw ? $"{f.Money(fw)} {f.CurrencyCode} at the end of the life" : "not stated"),
            ("Rate of return", rate),
            ("External rate of return", f.Percent(e.ExternalRate, "none")),
            ("Simple payback", PaybackText(e, e.SimplePaybackYears, UnavailableMeasures.SimplePayback, f)),
            ("Discounted payback", PaybackText(e, e.DiscountedPaybackYears, UnavailableMeasures.DiscountedPayback, f)),
            ("Benefit-cost ratio", e.BenefitCost.Conventional is double bc ? $"{f.Number(bc, 2)} (modified {(e.BenefitCost.Modified is double m ? f.Number(m, 2) : "–")})" : "not defined"),
        ]);
        flow.Gap(4);
        flow.Note("In plain words", Meaning(data, e, basis?.AnnualWorth ?? e.AnnualWorth, f), PacketStyle.BrandSoft);
    }

    /// <summary>One paragraph a reader without the methods can act on.</summary>
    internal static string Meaning(ProposalPacketData data, Evaluation e, double annualWorth, PacketFormat f)
    {
        double marr = e.Marr.EffectiveAnnual();
        string worth = e.PresentWorth >= 0
            ? $"At a MARR of {f.Percent(marr)} a year the proposal is worth {f.Money(e.PresentWorth)} {f.CurrencyCode} more today than leaving the money to earn the MARR elsewhere, the same as {f.Money(annualWorth)} {f.CurrencyCode} a year."
            : $"At a MARR of {f.Percent(marr)} a year the proposal is worth {f.Money(-e.PresentWorth)} {f.CurrencyCode} less today than leaving the money to earn the MARR elsewhere, the same as a loss of {f.Money(-annualWorth)} {f.CurrencyCode} a year.";
        string rate = e.RatesOfReturn.Count switch
        {
            1 when e.RatesOfReturn[0] >= marr => $" It earns {f.Percent(e.RatesOfReturn[0])} a year, above the MARR.",
            1 => $" It earns {f.Percent(e.RatesOfReturn[0])} a year, below the MARR.",
            0 => " No single rate of return describes its flows; judge it by its worth" + (e.ExternalRate is double x ? $" and its external rate of {f.Percent(x)}." : "."),
            _ => " Its flows have several rates of return, so none of them describes it; judge it by its worth" + (e.ExternalRate is double y ? $" and its external rate of {f.Percent(y)}." : "."),
        };
        string payback = e.DiscountedPaybackYears is double dp
            ? $" It recovers its first cost with interest at the MARR after {f.Number(dp, 1)} years."
            : e.Unavailable.GetValueOrDefault(UnavailableMeasures.DiscountedPayback) == UnavailableMeasures.NoFlows
                ? " It has no flows, so there is nothing to recover."
                : " It does not recover its first cost with interest at the MARR within its life.";
        return worth + rate + payback + $" The board's decision: {OutcomeText(data.Decision.Outcome).ToLowerInvariant()}.";
    }

    private static void PerPeriod(PageFlow flow, Evaluation e, IReadOnlyList<PeriodRow> periods, PacketFormat f)
    {
        var categories = PeriodTable.Categories;
        var rows = periods.Select(r => new TableRow([r.Period.ToString(f.Culture), .. categories.Select(c => f.Money(r.ByCategory[c])), f.Money(r.Net), f.Money(r.PresentWorth),
            f.Money(r.CumulativePresentWorth)])).ToList();
        rows.Add(new TableRow(["Total", .. categories.Select(c => f.Money(periods.Sum(r => r.ByCategory[c]))), f.Money(periods.Sum(r => r.Net)),
            f.Money(periods.Count == 0 ? 0 : periods[^1].CumulativePresentWorth), ""], Bold: true));
        TableWriter.Draw(flow,
        [
            new("Period", 0.8), new("Capital", 1.2, true), new("Operating", 1.2, true), new("Revenue", 1.2, true), new("Salvage", 1.2, true),
            new("Net", 1.2, true), new("Discounted at MARR", 1.3, true), new("Cumulative discounted", 1.4, true),
        ], rows);
        flow.Text($"Amounts in {f.CurrencyCode}; discounted at {f.Percent(e.MarrPerPeriod)} a period to period 0. The cumulative column crosses zero at the discounted payback.", PacketStyle.Small, PacketStyle.SoftBrush);
    }

    private static void PerElement(PageFlow flow, Evaluation e, IReadOnlyList<double> worths, Engine.Specifications.ModelSpec spec, PacketFormat f)
    {
        var rows = new List<TableRow>();
        for (int k = 0; k < e.Model.Elements.Count; k++)
        {
            var entered = spec.Elements![k]!;
            double pw = worths[k];
            string periods = entered.Period is int p ? p.ToString(f.Culture) : $"{entered.First}–{entered.Last}" + (entered.Every is int every ? $" every {every}" : "");
            string shape = entered.Type switch
            {
                Engine.Specifications.ElementKind.Arithmetic => $"{f.Money(entered.Amount ?? 0)}, then {f.Money(entered.Step ?? 0)} a period",
                Engine.Specifications.ElementKind.Geometric => $"{f.Money(entered.Amount ?? 0)}, then {f.Percent(entered.Growth ?? 0)} a period",
                _ => f.Money(entered.Amount ?? 0),
            };
            rows.Add(new TableRow([entered.Label ?? "", entered.Type is { } kind ? EnumWording.Of(kind) : "", entered.Category is { } category ? EnumWording.Of(category) : "", periods, shape, f.Money(pw)]));
        }
        rows.Add(new TableRow(["Present worth", "", "", "", "", f.Money(e.PresentWorth)], Bold: true));
        TableWriter.Draw(flow, [new("Element", 2.6), new("Shape", 1.1), new("Category", 1.1), new("Periods", 1.1), new("Amount", 2.2, true), new("PW at MARR", 1.4, true)], rows);
    }

    private static void AfterTax(PageFlow flow, Outcome<AfterTaxEvaluation> outcome, Engine.Depreciation.DepreciationSchedule? schedule, Engine.Taxes.OutlayAssets? outlays, PacketFormat f)
    {
        flow.Heading("After tax", PacketStyle.Heading1);
        flow.Note("Taxes", "Tax and depreciation rules vary by jurisdiction and by year. The after-tax figures are estimates from the rates and methods "
            + "entered with this version, not tax advice; the organisation's tax advisers decide how the investment is treated.", PacketStyle.Amber);
        if (outcome.Value is not { } r || schedule is null)
        {
            flow.Text("The tax settings of this version are not complete: " + string.Join("; ", outcome.Errors.Select(e => FieldWording.Message(e))), PacketStyle.Body);
            return;
        }
        string Rate(Evaluation e) => e.RatesOfReturn.Count switch { 0 => "none", 1 => f.Percent(e.RatesOfReturn[0]) + " (unique)", _ => "several" };
        var pairs = new List<(string, string)>
        {
            ("Income-tax rate", f.Percent(r.Settings.IncomeTaxRate) + (r.Settings.GainTaxRate is double g ? $"; on a gain at disposal above the cost {f.Percent(g)}" : "")),
            ("Depreciation", r.Settings.Depreciation.Method),
            ("Losses", r.Settings.Losses == Engine.Taxes.LossTreatment.Offset ? "offset against other income in their year" : "carried forward against later income"),
            ("After-tax MARR", $"{f.Percent(r.AfterTax.Marr.EffectiveAnnual())}: {r.AfterTaxMarrBasis}"),
            ("After-tax present worth", $"{f.Money(r.AfterTax.PresentWorth)} {f.CurrencyCode} (before tax {f.Money(r.BeforeTax.PresentWorth)})"),
            ("After-tax annual worth", $"{f.Money(r.AfterTax.AnnualWorth)} {f.CurrencyCode} a year"),
            ("After-tax rate of return", Rate(r.AfterTax)),
            ("Disposal", $"book value {f.Money(r.Table.BookValueAtDisposal)}, {(r.Table.GainOnDisposal >= 0 ? "gain" : "loss")} {f.Money(Math.Abs(r.Table.GainOnDisposal))}"),
        };
        if (r.Settings.Financing is { } loan && r.Equity is { } equity)
        {
            pairs.Add(("Financing", $"{f.Percent(loan.Share)} of the first cost borrowed at {f.Percent(loan.Rate)} over {loan.Term} years; equity present worth {f.Money(equity.PresentWorth)} {f.CurrencyCode}, rate of return {Rate(equity)}"));
        }
        flow.Pairs(pairs);
        flow.Heading("Depreciation schedule", PacketStyle.Heading2);
        TableWriter.Draw(flow, [new("Tax year", 1, true), new("Depreciation", 2, true), new("Share of basis", 1.5, true), new("Book value at year end", 2, true)],
            schedule.Amounts.Select((a, k) => new TableRow([(k + 1).ToString(f.Culture), f.Money(a), f.Percent(schedule.Basis == 0 ? 0 : a / schedule.Basis), f.Money(schedule.BookValueAfter(k + 1))])));
        if (outlays is { } o && o.Cost.Any(c => c > 0))
        {
            flow.Heading("Later capital outlays", PacketStyle.Heading2);
            flow.Text("Each capital cost after year 0 that is not marked as a repair is depreciated as an asset of its own (by the first cost's method unless a class or life of its own is named below) from the "
                + $"year it is spent; its book value, {f.Money(o.BookValueAtDisposal)} in all, is recovered with the first cost at disposal (in the book value above).", PacketStyle.Body);
            TableWriter.Draw(flow, [new("Year", 1, true), new("Cost capitalised", 2, true), new("Its depreciation", 2, true)],
                Enumerable.Range(1, o.Cost.Count - 1).Where(t => o.Cost[t] > 0 || o.Depreciation[t] > 0)
                    .Select(t => new TableRow([t.ToString(f.Culture), f.Money(o.Cost[t]), f.Money(o.Depreciation[t])])));
            var own = r.BeforeTax.Model.Elements.Where(e => e is { Category: Engine.CashFlows.CashFlowCategory.Capital, Expensed: false, DepreciatedAs: not null })
                .Select(e => $"{e.Label}: {OwnClass(e.DepreciatedAs!)}").ToList();
            flow.Text(own.Count == 0 ? "Every outlay is depreciated by the first cost's class or life."
                : "Depreciated by a class or life of its own (the others by the first cost's): " + string.Join("; ", own) + ".", PacketStyle.Body);
        }
        flow.Heading("After-tax cash flows", PacketStyle.Heading2);
        bool equityColumn = r.Equity is not null;
        var columns = new List<TableColumn>
        {
            new("Year", 0.7, true), new("Before tax", 1.2, true), new("Depreciation", 1.2, true), new("Taxable income", 1.3, true),
            new("Tax", 1.1, true), new("Credit", 1, true), new("After tax", 1.2, true),
        };
        if (equityColumn)
        {
            columns.Add(new("Equity", 1.2, true));
        }
        TableWriter.Draw(flow, columns, r.Table.Rows.Select(row => new TableRow(
        [
            row.Period.ToString(f.Culture), f.Money(row.BeforeTax), f.Money(row.Depreciation), f.Money(row.TaxableIncome), f.Money(row.Tax), f.Money(row.Credit), f.Money(row.AfterTax),
            .. equityColumn ? new[] { f.Money(row.Equity) } : [],
        ])));
        flow.Text($"Amounts in {f.CurrencyCode}. A negative tax is a saving against the organisation's other income.", PacketStyle.Small, PacketStyle.SoftBrush);
    }

    /// <summary>An outlay's own class or life in words.</summary>
    private static string OwnClass(Engine.Depreciation.OutlayClass own) => own.PropertyClass switch
    {
        Engine.Depreciation.MacrsClass.ResidentialRental => "MACRS 27.5-year residential rental property",
        Engine.Depreciation.MacrsClass.Nonresidential => "MACRS 39-year nonresidential real property",
        Engine.Depreciation.MacrsClass c => $"MACRS {(int)c}-year property",
        null => $"a life of {own.Life} years",
    };

    /// <summary>A payback in years; "—" for a model with no flows (nothing to recover, as on the pages), else "not within the life".</summary>
    private static string PaybackText(Evaluation e, double? years, string name, PacketFormat f) => years is double y ? $"{f.Number(y, 2)} years"
        : e.Unavailable.GetValueOrDefault(name) == UnavailableMeasures.NoFlows ? "—" : "not within the life";

    private static void Risk(PageFlow flow, Outcome<RiskStudy> study, SensitivityResult? sensitivity, SimulationSummary? simulation, PacketFormat f)
    {
        flow.Heading("Sensitivity and risk", PacketStyle.Heading1);
        if (study.Value is not { } prepared || sensitivity is null || simulation is null)
        {
            flow.Text("The risk settings of this version are not complete: " + string.Join("; ", study.Errors.Select(e => FieldWording.Message(e))), PacketStyle.Body);
            return;
        }
        var settings = prepared.Settings;
        var (bars, basis) = (sensitivity.Tornado, sensitivity.Basis);
        TableWriter.Draw(flow, [new("Parameter", 2.4), new("Input", 1.8), new("Low", 1.1, true), new("Most likely", 1.1, true), new("High", 1.1, true), new("Distribution", 1.2)],
            settings.Parameters.Select(p => new TableRow([p.Name, RiskInputs.Label(p.Target, prepared.Proposal.Model, prepared.Proposal.Tax), Value(p.Low), Value(p.MostLikely), Value(p.High), EnumWording.Of(p.Distribution)])));
        if (prepared.Drifts.Count > 0)
        {
            // The figures centre on the most likely values: a board member must see when those are not the model's.
            flow.Note("Most likely values apart from the model", string.Join(" ", prepared.Drifts.Select(d =>
                $"{d.Parameter.Name}: most likely {Shown(d.Parameter.Target, d.Parameter.MostLikely)}, the model's value {Shown(d.Parameter.Target, d.Current)}.")), PacketStyle.Amber);
        }
        flow.Figure(Math.Max(90, 34 + 26 * bars.Count), (g, area) => Charts.TornadoDrawing.Draw(g, area, bars, basis, f),
            $"Tornado: present worth with each parameter at its low (red-brown) and high (green) value, the others at most likely ({f.Money(basis)} {f.CurrencyCode}).");
        var result = simulation.Detail;
        // Amounts to whole units; rates and other small values to four decimals.
        string Value(double v) => Math.Abs(v) >= 100 ? f.Number(v, 0) : f.Number(v, 4);
        string Shown(string target, double v) => RiskUnits.IsRate(target) ? f.Percent(v) : Value(v);
        flow.Figure(190, (g, area) => Charts.DistributionDrawing.Draw(g, area, result, f),
            $"Present worth in {result.Trials.ToString("N0", f.Culture)} trials with seed {result.Seed}; the same seed and trial count give the same figures.");
        flow.Pairs(
        [
            ("Trials and seed", $"{result.Trials.ToString("N0", f.Culture)} trials, seed {result.Seed}"),
            ("Probability of a loss", $"{f.Percent(result.ProbabilityOfLoss)} of the trials have a present worth below zero"),
            ("Present worth", $"mean {f.Money(result.PresentWorth.Mean)}, P5 {f.Money(result.PresentWorth.P5)}, P50 {f.Money(result.PresentWorth.P50)}, P95 {f.Money(result.PresentWorth.P95)} {f.CurrencyCode}"),
            ("Annual worth", $"mean {f.Money(result.AnnualWorth.Mean)}, P5 {f.Money(result.AnnualWorth.P5)}, P95 {f.Money(result.AnnualWorth.P95)} {f.CurrencyCode} a year"),
        ]);
    }

    private static void History(PageFlow flow, ProposalPacketData data, IReadOnlyList<VersionDifference> changes, PacketFormat f)
    {
        flow.Heading("Version history", PacketStyle.Heading1);
        var versions = data.Proposal.Versions.Where(v => v.Number <= data.Version.Number).ToList();
        TableWriter.Draw(flow, [new("Version", 0.9, true), new("Made", 1.6), new("Reason", 2.6), new("State", 1.6), new("Assumptions SHA-256", 3.2)],
            versions.Select(v => new TableRow([v.Number.ToString(f.Culture), f.Time(v.CreatedAt), v.Reason, v.IsFrozen ? "submitted" : "draft", v.AssumptionsHash])));
        foreach (VersionDifference difference in changes)
        {
            flow.Heading($"Changes from version {difference.From} to version {difference.To}", PacketStyle.Heading2);
            TableWriter.Draw(flow, [new("Where", 2.6), new("What", 1.4), new("Before", 1.6, true), new("After", 1.6, true), new("Effect on PW", 1.4, true)],
                difference.Fields.Count == 0 ? [new TableRow(["no field changed", "", "", "", ""])]
                    : difference.Fields.Select(c => new TableRow([c.Subject, c.What, c.BeforeValue.Show(f), c.AfterValue.Show(f), c.PresentWorthEffect is double e ? f.Money(e) : "–"])));
        }
        if (changes.Count > 0)
        {
            flow.Text("Elements are numbered as in the editor. Effect on PW: the later version's present worth less the same with that one change undone, "
                + "every other change held, at the later version's MARR.", PacketStyle.Small, PacketStyle.SoftBrush);
        }
        if (versions.Count == 1)
        {
            flow.Text("The decision rests on the first version; there are no earlier versions to compare.", PacketStyle.Body);
            flow.Gap(6);
        }
    }
}
