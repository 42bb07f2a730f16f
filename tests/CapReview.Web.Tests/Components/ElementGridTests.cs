using CapReview.Engine.Specifications;
using CapReview.Web.Components.Evaluation;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Tests.Components;

public sealed class ElementGridTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();
    private readonly QuickEvaluationState _state = ComponentTestContext.Example();
    private int _changes;

    private IRenderedComponent<ElementGrid> Render() =>
        _context.Render<ElementGrid>(p => p
            .Add(c => c.State, _state)
            .Add(c => c.Changed, () => { _changes++; _state.Recalculate(); }));

    public void Dispose() => _context.Dispose();

    [Fact]
    public void Shows_one_row_per_element_with_only_the_fields_its_shape_uses()
    {
        var grid = Render();
        Assert.Equal(5, grid.FindAll("tr[data-testid=element-row]").Count);
        Assert.Equal("-185000", grid.Find("#el-0-amount").GetAttribute("value"));
        Assert.Empty(grid.FindAll("#el-0-first"));
        Assert.Equal("3", grid.Find("#el-1-growth").GetAttribute("value"));
        Assert.Equal("4", grid.Find("#el-3-every").GetAttribute("value"));
        Assert.Equal("-250", grid.Find("#el-2-step").GetAttribute("value"));
    }

    [Fact]
    public void Adding_an_element_appends_a_row_spanning_the_horizon()
    {
        var grid = Render();
        grid.Find("#new-element-type").Change(ElementKind.Recurring.ToString());
        grid.Find("button.button").Click();
        Assert.Equal(6, grid.FindAll("tr[data-testid=element-row]").Count);
        Assert.Equal(ElementKind.Recurring, _state.Draft.Elements[5].Type);
        Assert.Equal("12", grid.Find("#el-5-last").GetAttribute("value"));
        Assert.Equal("Element 6", grid.Find("#el-5-label").GetAttribute("value"));
        Assert.Equal(1, _changes);
    }

    [Fact]
    public void Removing_and_reordering_change_the_model()
    {
        var grid = Render();
        grid.Find("button[aria-label='Move element 2 up']").Click();
        Assert.Equal("Gas no longer bought for space heating", _state.Draft.Elements[0].Label);
        grid.Find("button[aria-label='Remove element 1']").Click();
        Assert.Equal(4, _state.Draft.Elements.Count);
        Assert.Equal("Heat exchangers and ducting", _state.Draft.Elements[0].Label);
        Assert.True(grid.Find("button[aria-label='Move element 1 up']").HasAttribute("disabled"));
        Assert.True(grid.Find("button[aria-label='Move element 4 down']").HasAttribute("disabled"));
        Assert.Equal(2, _changes);
    }

    [Fact]
    public void A_bad_value_is_marked_and_named_beside_its_field()
    {
        var grid = Render();
        grid.Find("#el-1-last").Input("30");
        var input = grid.Find("#el-1-last");
        Assert.Equal("true", input.GetAttribute("aria-invalid"));
        Assert.Equal("el-1-last-error", input.GetAttribute("aria-describedby"));
        Assert.Equal("The last period is after the horizon (12).", grid.Find("#el-1-last-error").TextContent);
        Assert.Contains("has-error", grid.FindAll("tr[data-testid=element-row]")[1].ClassName);

        grid.Find("#el-0-amount").Input("12,3,4x");
        Assert.Equal("“12,3,4x” is not a number.", grid.Find("#el-0-amount-error").TextContent);
    }

    [Fact]
    public void Changing_the_shape_shows_the_fields_of_the_new_shape()
    {
        var grid = Render();
        grid.Find("#el-0-type").Change(ElementKind.Arithmetic.ToString());
        Assert.NotEmpty(grid.FindAll("#el-0-first"));
        Assert.NotEmpty(grid.FindAll("#el-0-step"));
        Assert.Empty(grid.FindAll("#el-0-period"));
    }

    [Fact]
    public void Controls_are_disabled_until_the_page_is_interactive()
    {
        var grid = _context.Render<ElementGrid>(p => p.Add(c => c.State, _state).Add(c => c.Disabled, true));
        Assert.All(grid.FindAll("input, select, button"), e => Assert.True(e.HasAttribute("disabled")));
    }

    [Fact]
    public void After_tax_a_capital_cost_after_period_0_takes_a_repair_box_that_the_model_carries()
    {
        var beforeTax = Render();
        Assert.Empty(beforeTax.FindAll("[id$='-expensed']"));

        var grid = _context.Render<ElementGrid>(p => p
            .Add(c => c.State, _state)
            .Add(c => c.AfterTax, true)
            .Add(c => c.Changed, () => { _changes++; _state.Recalculate(); }));
        // Only the exchanger overhaul (capital, every 4 periods from period 4); not the first cost nor the revenue.
        Assert.Equal(["el-3-expensed"], grid.FindAll("[id$='-expensed']").Select(b => b.Id));
        Assert.False(grid.Find("#el-3-expensed").HasAttribute("checked"));
        grid.Find("#el-3-expensed").Change(true);
        Assert.True(_state.Draft.Elements[3].Expensed);
        Assert.True(_state.Draft.Read(System.Globalization.CultureInfo.GetCultureInfo("en-IE")).Spec.Elements![3]!.Expensed);
        Assert.Null(_state.Draft.Read(System.Globalization.CultureInfo.GetCultureInfo("en-IE")).Spec.Elements![4]!.Expensed);
        Assert.Equal(1, _changes);
    }

    [Fact]
    public void A_ticked_box_on_an_element_it_no_longer_fits_stays_in_view_with_its_reason()
    {
        var grid = _context.Render<ElementGrid>(p => p
            .Add(c => c.State, _state)
            .Add(c => c.AfterTax, true)
            .Add(c => c.Changed, () => { _changes++; _state.Recalculate(); }));
        grid.Find("#el-3-expensed").Change(true);
        grid.Find("#el-3-category").Change(Engine.CashFlows.CashFlowCategory.Operating.ToString());
        Assert.True(grid.Find("#el-3-expensed").HasAttribute("checked"));
        Assert.Contains("Only a capital cost after period 0", grid.Find("#el-3-expensed-error").TextContent, StringComparison.Ordinal);
        grid.Find("#el-3-expensed").Change(false);
        Assert.Empty(grid.FindAll("#el-3-expensed"));
    }

    [Fact]
    public void Under_MACRS_a_capital_cost_after_period_0_takes_a_class_of_its_own_that_the_model_carries()
    {
        var grid = _context.Render<ElementGrid>(p => p
            .Add(c => c.State, _state)
            .Add(c => c.AfterTax, true)
            .Add(c => c.OutlayMethod, DepreciationMethod.Macrs)
            .Add(c => c.Changed, () => { _changes++; _state.Recalculate(); }));
        // Only the exchanger overhaul; it starts at the first cost's method.
        Assert.Equal(["el-3-depreciatedAs"], grid.FindAll("select[id$='-depreciatedAs']").Select(b => b.Id));
        Assert.Equal("the first cost's method", grid.Find("#el-3-depreciatedAs option[selected]").TextContent);
        Assert.Null(_state.Draft.Read(System.Globalization.CultureInfo.GetCultureInfo("en-IE")).Spec.Elements![3]!.DepreciatedAs);
        grid.Find("#el-3-depreciatedAs").Change(Engine.Depreciation.MacrsClass.Nonresidential.ToString());
        Assert.Equal(Engine.Depreciation.MacrsClass.Nonresidential, _state.Draft.Read(System.Globalization.CultureInfo.GetCultureInfo("en-IE")).Spec.Elements![3]!.DepreciatedAs!.PropertyClass);
        Assert.Equal("39-year nonresidential real property", grid.Find("#el-3-depreciatedAs option[selected]").TextContent);
        // A repair takes no class: the choice goes with the tick.
        grid.Find("#el-3-depreciatedAs").Change("");
        grid.Find("#el-3-expensed").Change(true);
        Assert.Empty(grid.FindAll("#el-3-depreciatedAs"));
    }
}
