using CapReview.Engine.Rates;
using CapReview.Web.Components.Evaluation;

namespace CapReview.Web.Tests.Components;

public sealed class MeasuresAndSettingsTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    public void Dispose() => _context.Dispose();

    [Fact]
    public void Measures_show_the_example_rounded_in_the_organisation_culture()
    {
        var state = ComponentTestContext.Example();
        var panel = _context.Render<MeasuresPanel>(p => p.Add(c => c.State, state));
        string expected = Math.Round(state.Result!.PresentWorth, 0, MidpointRounding.AwayFromZero).ToString("#,##0", System.Globalization.CultureInfo.GetCultureInfo("en-IE"));
        Assert.Equal(expected, panel.Find("[data-testid=present-worth]").TextContent);
        Assert.Matches(@"^\d+\.\d\d %$", panel.Find("[data-testid=rate-of-return]").TextContent);
        Assert.Contains("recovers its costs", panel.Find("[data-testid=verdict]").TextContent);
    }

    [Fact]
    public void The_empty_model_shows_no_payback()
    {
        var state = ComponentTestContext.Example();
        state.Draft.Elements.Clear();
        state.Draft.Elements.Add(new CapReview.Web.QuickEvaluation.ElementDraft { Type = Engine.Specifications.ElementKind.Single, Label = "First cost", Period = "0", Amount = "0" });
        state.Recalculate();
        var panel = _context.Render<MeasuresPanel>(p => p.Add(c => c.State, state));
        Assert.Equal("—", panel.Find("[data-testid=simple-payback]").TextContent);
        Assert.Equal("—", panel.Find("[data-testid=discounted-payback]").TextContent);
    }

    [Fact]
    public void Invalid_input_lists_what_needs_attention_instead_of_measures()
    {
        var state = ComponentTestContext.Example();
        state.Draft.Horizon = "0";
        state.Draft.Elements[1].GrowthPercent = "-150";
        state.Recalculate();
        var panel = _context.Render<MeasuresPanel>(p => p.Add(c => c.State, state));
        Assert.Empty(panel.FindAll("[data-testid=measures]"));
        Assert.Contains("1 field needs attention", panel.Markup);
        Assert.Contains("Horizon", panel.Find(".error-list").TextContent);
    }

    [Fact]
    public void Several_rates_of_return_are_listed_with_a_warning()
    {
        var state = ComponentTestContext.Example();
        state.Draft.Elements.Clear();
        state.Draft.Horizon = "3";
        foreach (var (period, amount) in new[] { (0, "-1000"), (1, "3600"), (2, "-4310"), (3, "1716") })
        {
            state.Draft.Elements.Add(new CapReview.Web.QuickEvaluation.ElementDraft { Type = Engine.Specifications.ElementKind.Single, Label = $"p{period}", Period = period.ToString(), Amount = amount });
        }
        state.Recalculate();
        var panel = _context.Render<MeasuresPanel>(p => p.Add(c => c.State, state));
        Assert.Equal("several: 10.00 %, 20.00 %, 30.00 %", panel.Find("[data-testid=rate-of-return]").TextContent);
        Assert.Contains("No single rate describes this proposal", panel.Markup);
    }

    [Fact]
    public void A_nominal_rate_asks_for_its_compoundings_and_names_a_bad_one()
    {
        var state = ComponentTestContext.Example();
        var settings = _context.Render<ModelSettings>(p => p.Add(c => c.State, state).Add(c => c.Changed, state.Recalculate));
        Assert.Empty(settings.FindAll("#compoundings"));
        settings.Find("#basis").Change(RateBasis.Nominal.ToString());
        settings.Find("#compoundings").Input("0");
        Assert.Equal("true", settings.Find("#compoundings").GetAttribute("aria-invalid"));
        Assert.Contains("between 1 and 8760", settings.Find("#compoundings-error").TextContent);
        settings.Find("#compoundings").Input("12");
        Assert.Contains("effective annual", settings.Find(".derived").TextContent);
    }

    [Fact]
    public void The_cash_flow_diagram_offers_its_figures_as_a_table()
    {
        var diagram = _context.Render<CashFlowDiagram>(p => p.Add(c => c.NetFlows, new[] { -1000.0, 300, 300 }).Add(c => c.PeriodsPerYear, 1));
        var cells = diagram.FindAll("table.figures tbody tr");
        Assert.Equal(3, cells.Count);
        Assert.Equal("−400", cells[2].Children[2].TextContent);
        Assert.Contains("Largest payment −1,000", diagram.Find("figcaption").TextContent);
    }
}
