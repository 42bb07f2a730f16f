using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Web.Components.Proposals;
using CapReview.Web.ProposalForms;

namespace CapReview.Web.Tests.Components;

public sealed class RiskPanelTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    private static readonly ModelSpec Plant = new()
    {
        Horizon = 10,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 70_000 },
        ],
    };

    private static readonly CapReview.Reviews.Access.Actor Lead = CapReview.Reviews.Access.Actor.Of("lead-1", "Ada Lead", CapReview.Reviews.Access.Role.ProjectLead);

    private static RiskDraft Draft()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Saving", Target = "elements[1].amount", Low = "50,000", MostLikely = "70,000", High = "90,000" });
        return draft;
    }

    [Fact]
    public void A_board_member_may_try_scenarios_on_a_version_they_cannot_edit_and_others_may_not()
    {
        var board = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, Draft()).Add(x => x.Model, Plant).Add(x => x.Disabled, true).Add(x => x.BoardWhatIf, true));
        Assert.NotEmpty(board.FindAll("[data-testid=add-scenario]"));
        Assert.NotEmpty(board.FindAll("[data-testid=board-scenarios]"));
        // The figures come from the domain off the circuit's thread: they appear once that work is done.
        board.WaitForAssertion(() => Assert.Single(board.FindAll("[data-testid=tornado-table] tbody tr")));
        var reader = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, Draft()).Add(x => x.Model, Plant).Add(x => x.Disabled, true));
        Assert.Empty(reader.FindAll("[data-testid=add-scenario]"));
    }

    [Fact]
    public void The_tornado_and_break_even_of_a_parameter_are_shown()
    {
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, Draft()).Add(x => x.Model, Plant));
        // Hand computation: break-even saving 400,000 / (P/A, 10 %, 10) = 400,000 / 6.1446 = 65,098.16.
        panel.WaitForAssertion(() => Assert.Contains("65,098.16", panel.Find("[data-testid=tornado-table]").TextContent));
    }

    [Fact]
    public void The_simulation_runs_the_trials_just_typed()
    {
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, Draft()).Add(x => x.Model, Plant));
        panel.WaitForElement("[data-testid=tornado-table]");
        panel.Find("#risk-trials").Change("2,000");
        panel.Find("[data-testid=run-simulation]").Click();
        panel.WaitForAssertion(() => Assert.Contains("2,000 trials run with seed 2027", panel.Find("[data-testid=risk-message]").TextContent, StringComparison.Ordinal));
        Assert.NotEmpty(panel.FindAll("[data-testid=simulation-summary]"));
    }

    private static ModelSpec PlantSaving(double saving) => Plant with
    {
        Elements = [Plant.Elements![0], Plant.Elements[1]! with { Id = "saving", Amount = saving }],
    };

    [Fact]
    public void Picking_the_marr_prefills_percent_as_the_rest_of_the_page()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "MARR" });
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, draft).Add(x => x.Model, Plant));
        panel.Find("#risk-target-0").Change("rate");
        // The plant's MARR is 10 %: typed as 10, a fifth either side 8 and 12 (not 0.1, 0.08 and 0.12).
        Assert.Equal(("8", "10", "12"), (draft.Parameters[0].Low, draft.Parameters[0].MostLikely, draft.Parameters[0].High));
        panel.WaitForAssertion(() => Assert.Single(panel.FindAll("[data-testid=tornado-table] tbody tr")));
        Assert.Contains("%", panel.Find("#risk-likely-0").Parent!.TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void A_life_that_the_elements_outrun_gets_its_message_at_the_low_value_in_words()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Life", Target = "horizon", Low = "8", MostLikely = "10", High = "12" });
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, draft).Add(x => x.Model, Plant));
        panel.WaitForAssertion(() => Assert.StartsWith("Low: at 8 the model cannot be evaluated", panel.Find("#risk-low-0-error").TextContent, StringComparison.Ordinal));
        Assert.Equal("true", panel.Find("#risk-low-0").GetAttribute("aria-invalid"));
        Assert.DoesNotContain("risk.parameters", panel.Find("[data-testid=risk-errors]").TextContent, StringComparison.Ordinal);
        Assert.Empty(panel.FindAll("[data-testid=tornado-table]"));
    }

    [Fact]
    public void Editing_the_element_moves_a_parameter_that_followed_it_before_the_tornado_uses_it()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Saving", Target = "elements[#saving].amount", Low = "50000", MostLikely = "70000", High = "90000" });
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, draft).Add(x => x.Model, PlantSaving(70_000)));
        panel.Render(p => p.Add(x => x.Model, PlantSaving(80_000)));
        Assert.Equal(("60000", "80000", "100000"), (draft.Parameters[0].Low, draft.Parameters[0].MostLikely, draft.Parameters[0].High));
        // At 60,000 and 100,000 a year: PW = −400,000 + saving × (P/A, 10 %, 10), (P/A) = 6.144567.
        panel.WaitForAssertion(() => Assert.Contains("-31,326", panel.Find("[data-testid=tornado-table]").TextContent.Replace('−', '-'), StringComparison.Ordinal));
        Assert.Empty(panel.FindAll("[data-testid^=risk-drift]"));
    }

    [Fact]
    public void A_parameter_set_apart_from_its_element_says_by_how_much_it_differs()
    {
        var draft = new RiskDraft();
        draft.Parameters.Add(new ParameterDraft { Name = "Saving", Target = "elements[#saving].amount", Low = "50000", MostLikely = "65000", High = "90000" });
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, draft).Add(x => x.Model, PlantSaving(70_000)));
        panel.Render(p => p.Add(x => x.Model, PlantSaving(80_000)));
        Assert.Equal("65000", draft.Parameters[0].MostLikely);
        panel.WaitForAssertion(() => Assert.Contains("differs from the model's value now, 80,000.00, by -15,000.00", panel.Find("[data-testid=risk-drift-0]").TextContent.Replace('−', '-'), StringComparison.Ordinal));
    }

    public void Dispose() => _context.Dispose();
}
