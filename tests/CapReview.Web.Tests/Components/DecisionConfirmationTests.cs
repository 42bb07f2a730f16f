using CapReview.Reviews.Decisions;
using CapReview.Web.Components;
using CapReview.Web.Components.Cycles;

namespace CapReview.Web.Tests.Components;

/// <summary>
/// The cycle page's decision panel as a member uses it: a decided proposal offers a return for changes as a change, the
/// confirmation says what a change does, and a decision or the selected portfolio's approvals that break the board's
/// rules are recorded only with an explicit override naming the rules and a reason.
/// </summary>
public sealed class DecisionConfirmationTests
{
    private static readonly RuleStanding OverLimit = new("year:0", "The approved first cost stays within the capital limit of the cycle's budget year",
        "420,000 approved against a limit of 250,000", RuleState.Broken, 170_000);

    private static readonly RuleStanding Prerequisite = new("needs:5:6", "P-0005 is approved only with its prerequisite P-0006",
        "P-0006 is returned for changes", RuleState.Broken);

    [Fact]
    public void A_decided_proposal_offers_every_outcome_a_return_for_changes_included_and_nothing_is_preselected()
    {
        using var context = ComponentTestContext.Create();
        int recorded = 0;
        var entry = new DecisionEntry();
        var choice = context.Render<DecisionChoice>(p => p.Add(c => c.ProposalId, 3).Add(c => c.Reference, "P-0003").Add(c => c.Entry, entry)
            .Add(c => c.Changing, true).Add(c => c.Enabled, true).Add(c => c.OnRecord, () => recorded++));

        var select = choice.Find("select");
        Assert.Equal("Change the decision on P-0003", select.GetAttribute("aria-label"));
        Assert.Equal(["Change to…", "Approve", "Return for changes", "Reject"], choice.FindAll("option").Select(o => o.TextContent));
        Assert.True(choice.Find("button").HasAttribute("disabled"));

        select.Change(nameof(DecisionOutcome.ReturnForChanges));
        Assert.Equal(DecisionOutcome.ReturnForChanges, entry.Outcome);
        Assert.Equal("Comment for the lead of P-0003", choice.Find("input").GetAttribute("aria-label"));
        choice.Find("button").Click();
        Assert.Equal(1, recorded);
    }

    [Fact]
    public void A_change_to_a_return_says_it_supersedes_the_decision_and_sends_the_proposal_back_with_the_comment()
    {
        using var context = ComponentTestContext.Create();
        RuleOverrideChoice? confirmed = null;
        var dialog = context.Render<DecisionConfirmation>(p => p.Add(c => c.Reference, "P-0003").Add(c => c.Title, "Feed pump").Add(c => c.Version, 1)
            .Add(c => c.Outcome, DecisionOutcome.ReturnForChanges).Add(c => c.Changing, true).Add(c => c.Conditions, "Quote the spare impeller too")
            .Add(c => c.OnConfirm, (RuleOverrideChoice c) => confirmed = c));

        string text = dialog.Find("[data-testid=confirm-decision]").TextContent;
        Assert.Contains("Record a return for changes on P-0003 Feed pump, version 1?", text, StringComparison.Ordinal);
        Assert.Contains("It supersedes the decision recorded before; both stay in the record and the audit trail.", text, StringComparison.Ordinal);
        Assert.Contains("Comment for the lead: Quote the spare impeller too", text, StringComparison.Ordinal);
        Assert.Equal("P-0003 goes back to its lead for changes, with this comment from the board. The board decides it again once its lead resubmits it. "
            + "Until then it is not approved, and the cycle cannot be signed off.", Normalised(dialog.Find("[data-testid=return-explained]").TextContent));
        Assert.Empty(dialog.FindAll("[data-testid=rule-override]"));

        dialog.FindAll("button").Single(b => b.TextContent == "Yes, record").Click();
        Assert.Equal(RuleOverrideChoice.None, confirmed);
    }

    [Fact]
    public void A_decision_that_breaks_a_rule_is_confirmed_only_with_the_override_naming_the_rule_and_a_reason()
    {
        using var context = ComponentTestContext.Create();
        RuleOverrideChoice? confirmed = null;
        var dialog = context.Render<DecisionConfirmation>(p => p.Add(c => c.Reference, "P-0006").Add(c => c.Title, "Ducting").Add(c => c.Version, 2)
            .Add(c => c.Outcome, DecisionOutcome.ReturnForChanges).Add(c => c.Changing, true).Add(c => c.Broken, [Prerequisite])
            .Add(c => c.OnConfirm, (RuleOverrideChoice c) => confirmed = c));
        var yes = () => dialog.FindAll("button").Single(b => b.TextContent == "Yes, record");

        Assert.Equal("Record despite breaking the rule: P-0005 is approved only with its prerequisite P-0006 (P-0006 is returned for changes)",
            Normalised(dialog.Find("[data-testid=broken-rules]").TextContent));
        Assert.True(yes().HasAttribute("disabled"));
        Assert.True(dialog.Find("#decision-reason").HasAttribute("disabled"));

        dialog.Find("#decision-override").Change(true);
        Assert.True(yes().HasAttribute("disabled"));
        dialog.Find("#decision-reason").Input("   ");
        Assert.True(yes().HasAttribute("disabled"));
        dialog.Find("#decision-reason").Input("The ducting route changes");
        Assert.False(yes().HasAttribute("disabled"));

        yes().Click();
        Assert.Equal(new RuleOverrideChoice(true, "The ducting route changes"), confirmed);
    }

    [Fact]
    public void The_selected_portfolio_lists_each_approval_and_asks_for_an_override_with_a_reason_when_the_set_breaks_a_rule()
    {
        using var context = ComponentTestContext.Create();
        RuleOverrideChoice? confirmed = null;
        IReadOnlyList<PortfolioApproval> plan =
        [
            new PortfolioApproval(1, "P-0001", "Compressor A", 1, 120_000),
            new PortfolioApproval(2, "P-0002", "Lighting B", 2, 100_000),
        ];
        var dialog = context.Render<PortfolioApprovalConfirmation>(p => p.Add(c => c.Plan, plan).Add(c => c.Broken, [OverLimit])
            .Add(c => c.OnConfirm, (RuleOverrideChoice c) => confirmed = c));
        var yes = () => dialog.FindAll("button").Single(b => b.TextContent == "Yes, approve these 2");

        // en-IE grouping.
        Assert.Equal(["P-0001 Compressor A, version 1, first cost 120,000", "P-0002 Lighting B, version 2, first cost 100,000"],
            dialog.FindAll("[data-testid=portfolio-approvals] li").Select(li => Normalised(li.TextContent)));
        Assert.Contains("These approvals, with the decisions already recorded, break the board's rules. To record all the same, override them and say why.",
            Normalised(dialog.Find("[data-testid=rule-override]").TextContent), StringComparison.Ordinal);
        Assert.Equal("Record despite breaking the rule: The approved first cost stays within the capital limit of the cycle's budget year (420,000 approved against a limit of 250,000)",
            Normalised(dialog.Find("[data-testid=broken-rules]").TextContent));
        Assert.True(yes().HasAttribute("disabled"));

        dialog.Find("#portfolio-reason").Input("The conveyor is funded from the plant's own budget");
        Assert.True(yes().HasAttribute("disabled"));
        dialog.Find("#portfolio-override").Change(true);
        Assert.False(yes().HasAttribute("disabled"));
        yes().Click();
        Assert.Equal(new RuleOverrideChoice(true, "The conveyor is funded from the plant's own budget"), confirmed);
    }

    [Fact]
    public void The_selected_portfolio_that_breaks_no_rule_is_confirmed_without_an_override()
    {
        using var context = ComponentTestContext.Create();
        RuleOverrideChoice? confirmed = null;
        var dialog = context.Render<PortfolioApprovalConfirmation>(p => p.Add(c => c.Plan, [new PortfolioApproval(1, "P-0001", "Compressor A", 1, 120_000)])
            .Add(c => c.OnConfirm, (RuleOverrideChoice c) => confirmed = c));
        Assert.Empty(dialog.FindAll("[data-testid=rule-override]"));
        dialog.FindAll("button").Single(b => b.TextContent == "Yes, approve it").Click();
        Assert.Equal(RuleOverrideChoice.None, confirmed);
    }

    private static string Normalised(string text) => string.Join(' ', text.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries));
}
