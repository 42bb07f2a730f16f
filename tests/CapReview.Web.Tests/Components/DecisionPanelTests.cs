using CapReview.Reviews.Decisions;
using CapReview.Reviews.Records;
using CapReview.Web.Components.Cycles;

namespace CapReview.Web.Tests.Components;

/// <summary>The cycle page's standing of the decisions against the board's rules, and the packet job's progress, as shown.</summary>
public sealed class DecisionPanelTests
{
    [Fact]
    public void Each_budget_year_shows_what_is_approved_against_its_limit_and_each_rule_its_state_in_words()
    {
        using var context = ComponentTestContext.Create();
        var standing = new DecisionStanding(
            [new BudgetYearStanding(0, 220_000, 200_000), new BudgetYearStanding(1, 30_000, 50_000)],
            [
                new RuleStanding("group:Paint line", "At most one of Paint line (P-0001, P-0002) is approved", "approved: P-0001", RuleState.Met),
                new RuleStanding("group:Heating", "Exactly one of Heating (P-0003, P-0004) is approved", "none approved", RuleState.Open),
                new RuleStanding("needs:5:6", "P-0005 is approved only with its prerequisite P-0006", "P-0006 is rejected", RuleState.Broken),
            ]);
        var panel = context.Render<DecisionStandingPanel>(p => p.Add(c => c.Standing, standing));

        var years = panel.FindAll("[data-testid=budget-year]");
        Assert.Equal(2, years.Count);
        // en-IE grouping; 200,000 − 220,000 = −20,000 with the one minus sign.
        Assert.Equal(["This cycle's year", "220,000", "200,000", "\u221220,000 (over the limit)"], years[0].Children.Select(c => c.TextContent.Trim()));
        Assert.Equal(["Year 1", "30,000", "50,000", "20,000"], years[1].Children.Select(c => c.TextContent.Trim()));
        Assert.Equal(["kept", "open", "broken"], panel.FindAll("[data-testid=rule-standings] li").Select(li => li.GetAttribute("data-state")));
        Assert.Contains("P-0005 is approved only with its prerequisite P-0006: P-0006 is rejected", panel.Find("[data-testid=rule-standings]").TextContent, StringComparison.Ordinal);
        Assert.DoesNotContain("Broken", panel.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public void A_running_packet_job_says_how_many_of_the_cycles_packets_are_made()
    {
        using var context = ComponentTestContext.Create();
        var now = new DateTimeOffset(2027, 4, 1, 9, 0, 0, TimeSpan.Zero);
        var job = new PacketJobView(1, PacketJobStatus.Running, 1, "Tove Board", now, now, null, null, null, 0);
        var line = context.Render<PacketJobLine>(p => p.Add(c => c.Job, job).Add(c => c.Made, 3).Add(c => c.Expected, 7));
        Assert.Equal("3 of 7 packets made", line.Find("[data-testid=packet-progress]").TextContent);

        line.Render(p => p.Add(c => c.Made, 4));
        Assert.Equal("4 of 7 packets made", line.Find("[data-testid=packet-progress]").TextContent);
    }
}
