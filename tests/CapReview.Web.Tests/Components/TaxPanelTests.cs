using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Web.Components.Proposals;
using CapReview.Web.ProposalForms;
using Microsoft.VisualBasic;

namespace CapReview.Web.Tests.Components;

public sealed class TaxPanelTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    private static readonly ModelSpec Press = new()
    {
        Horizon = 5,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -100_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Labour saved", Category = CashFlowCategory.Revenue, First = 1, Last = 5, Amount = 30_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 5, Amount = 10_000 },
        ],
    };

    [Fact]
    public void The_panel_shows_the_caution_and_the_after_tax_figures_beside_the_before_tax_ones()
    {
        var draft = new TaxDraft { Enabled = true, IncomeTaxPercent = "25", Method = DepreciationMethod.StraightLine, Life = "5", Salvage = "10,000" };
        var panel = _context.Render<TaxPanel>(p => p.Add(x => x.Draft, draft).Add(x => x.Model, Press));
        Assert.Contains("Tax rules vary by jurisdiction and by year", panel.Find("[data-testid=tax-caution]").TextContent);
        // Hand computation: 27,000 a year after tax and the resale at book value; Microsoft.VisualBasic.Financial.IRR.
        double[] flows = [-100_000, 27_000, 27_000, 27_000, 27_000, 37_000];
        double irr = Financial.IRR(ref flows);
        Assert.Equal((irr * 100).ToString("0.00", System.Globalization.CultureInfo.InvariantCulture) + " %", panel.Find("[data-testid=after-tax-rate]").TextContent);
        Assert.Equal(6, panel.FindAll("[data-testid=after-tax-table] tbody tr").Count);
    }

    [Fact]
    public void A_bad_field_is_named_and_nothing_is_computed()
    {
        var draft = new TaxDraft { Enabled = true, IncomeTaxPercent = "twenty", Method = DepreciationMethod.StraightLine, Life = "5" };
        var panel = _context.Render<TaxPanel>(p => p.Add(x => x.Draft, draft).Add(x => x.Model, Press));
        string errors = panel.Find("[data-testid=tax-errors]").TextContent;
        Assert.Contains("Income-tax rate: ", errors, StringComparison.Ordinal);
        Assert.DoesNotContain("tax.incomeTaxRate", errors, StringComparison.Ordinal);
        Assert.Empty(panel.FindAll("[data-testid=after-tax-table]"));
    }

    [Fact]
    public void Settings_survive_a_round_trip_through_the_stored_form()
    {
        var culture = System.Globalization.CultureInfo.GetCultureInfo("en-IE");
        var draft = new TaxDraft { Enabled = true, IncomeTaxPercent = "21", StateTaxPercent = "6", Method = DepreciationMethod.Macrs, Financed = true };
        draft.Credits.Add(new CreditDraft { Year = "1", Amount = "5,000" });
        var (spec, errors) = draft.Read(culture);
        Assert.Empty(errors);
        var again = TaxDraft.From(spec, culture).Read(culture).Spec!;
        Assert.Equal(0.21, again.IncomeTaxRate!.Value, 12);
        Assert.Equal(0.06, again.StateTaxRate!.Value, 12);
        Assert.Equal(Engine.Depreciation.MacrsClass.SevenYear, again.Depreciation!.PropertyClass);
        Assert.Equal(5_000, again.Credits![0]!.Amount);
        Assert.Equal(0.5, again.Loan!.Share!.Value, 12);
        Assert.Null(new TaxDraft().Read(culture).Spec);
    }

    [Fact]
    public void A_saved_MACRS_draft_switched_to_straight_line_has_a_life_to_start_from()
    {
        // Found by the editor's random walk: the life came back blank and the save was refused at a field nobody emptied.
        var culture = System.Globalization.CultureInfo.GetCultureInfo("en-IE");
        var (spec, _) = new TaxDraft { Enabled = true, IncomeTaxPercent = "21", Method = DepreciationMethod.Macrs }.Read(culture);
        var reopened = TaxDraft.From(spec, culture);
        reopened.Method = DepreciationMethod.StraightLine;
        var (again, errors) = reopened.Read(culture);
        Assert.Empty(errors);
        Assert.Equal(10, again!.Depreciation!.Life);
    }

    public void Dispose() => _context.Dispose();
}
