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

    public void Dispose() => _context.Dispose();
}
