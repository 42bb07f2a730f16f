using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Access;
using CapReview.Reviews.Runs;
using CapReview.Web.Components;
using CapReview.Web.Components.Proposals;
using CapReview.Web.ProposalForms;
using Microsoft.Extensions.DependencyInjection;

namespace CapReview.Web.Tests.Components;

/// <summary>The risk panel under the run limits: it says plainly why a simulation did not start, and stops one when the page's connection goes.</summary>
public sealed class RunLimitPanelTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    private static readonly Actor Lead = Actor.Of("lead-7", "Bea Lead", Role.ProjectLead);

    private static readonly ModelSpec Plant = new()
    {
        Horizon = 1200,
        PeriodsPerYear = 12,
        Rate = new RateSpec { Value = 0.10 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 600, Amount = 7_000 },
        ],
    };

    private static RiskDraft Draft(string trials)
    {
        // The life varied: every trial takes the full evaluation of a 1,200-period model, so a run lasts.
        var draft = new RiskDraft { Trials = trials };
        draft.Parameters.Add(new ParameterDraft { Name = "Life", Target = "horizon", Low = "900", MostLikely = "1,000", High = "1,200" });
        return draft;
    }

    private IRenderedComponent<RiskPanel> Panel(string trials)
    {
        var panel = _context.Render<RiskPanel>(p => p.Add(x => x.Actor, Lead).Add(x => x.Draft, Draft(trials)).Add(x => x.Model, Plant));
        panel.WaitForElement("[data-testid=tornado-table]");
        return panel;
    }

    [Fact]
    public void A_person_at_their_limit_is_told_plainly_and_nothing_runs()
    {
        var limiter = _context.Services.GetRequiredService<RunLimiter>();
        using RunLease first = limiter.Enter(Lead), second = limiter.Enter(Lead);
        var panel = Panel("1,000");
        panel.Find("[data-testid=run-simulation]").Click();
        panel.WaitForAssertion(() => Assert.Contains("You already have 2 simulations or portfolio calculations running",
            panel.Find("[data-testid=risk-message]").TextContent, StringComparison.Ordinal));
        Assert.Empty(panel.FindAll("[data-testid=simulation-summary]"));
        Assert.Equal(2, limiter.Running);
    }

    [Fact]
    public void A_run_over_the_work_budget_is_refused_naming_the_trials()
    {
        var panel = Panel("900,000");
        panel.Find("[data-testid=run-simulation]").Click();
        // 900,000 trials × 1,201 periods × 2 elements = 2,161,800,000 units, over the default budget of 2,000,000,000.
        panel.WaitForAssertion(() => Assert.Contains("Trials: 900,000 trials of 1,201 periods and 2 elements is 2,161,800,000 units of work",
            panel.Find("[data-testid=risk-message]").TextContent, StringComparison.Ordinal));
        Assert.Equal(0, _context.Services.GetRequiredService<RunLimiter>().Running);
    }

    [Fact]
    public void A_run_stops_when_the_page_connection_goes_down_and_gives_its_place_back()
    {
        var limiter = _context.Services.GetRequiredService<RunLimiter>();
        var panel = Panel("500,000");
        panel.Find("[data-testid=run-simulation]").Click();
        panel.WaitForAssertion(() => Assert.Equal(1, limiter.Running));
        // What Blazor calls when the browser's connection drops (the tab closed); the circuit itself lives on for minutes.
        _context.Services.GetRequiredService<PageLifetime>().Stop();
        panel.WaitForAssertion(() => Assert.Contains("The simulation was cancelled", panel.Find("[data-testid=risk-message]").TextContent, StringComparison.Ordinal));
        Assert.Equal(0, limiter.Running);
    }

    public void Dispose() => _context.Dispose();
}
