using CapReview.Web.Components.Layout;

namespace CapReview.Web.Tests.Components;

public sealed class PageBoundaryTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();
    private readonly FormDraft _draft = new();

    public void Dispose() => _context.Dispose();

    private IRenderedComponent<PageBoundary> Render(bool refused = false) =>
        _context.Render<PageBoundary>(p => p
            .Add(b => b.Area, "The portfolio")
            .AddChildContent<FailingForm>(f => f.Add(c => c.Draft, _draft).Add(c => c.RefusedByTheDomain, refused)));

    [Fact]
    public void A_failing_action_says_what_failed_and_keeps_what_was_typed()
    {
        var page = Render();
        page.Find("#note").Change("Board asked for the lower limit");
        page.Find("#fail").Click();

        var alert = page.Find("[data-testid=page-failure]");
        Assert.Equal("alert", alert.GetAttribute("role"));
        Assert.Contains("The portfolio could not finish:", alert.TextContent, StringComparison.Ordinal);
        Assert.Contains("something unexpected went wrong", alert.TextContent, StringComparison.Ordinal);
        Assert.Contains("What you typed is still here.", alert.TextContent, StringComparison.Ordinal);
        // The internal message is for the log, not the page.
        Assert.DoesNotContain("disk", alert.TextContent, StringComparison.Ordinal);
        Assert.Equal("Board asked for the lower limit", page.Find("#note").GetAttribute("value"));
    }

    [Fact]
    public void The_page_stays_usable_after_a_failure_and_the_message_can_be_dismissed()
    {
        var page = Render();
        page.Find("#fail").Click();
        page.Find("#save").Click();
        page.Find("#save").Click();
        Assert.Equal("2", page.Find("#saves").TextContent);

        page.Find("[data-testid=page-failure-dismiss]").Click();
        Assert.Empty(page.FindAll("[data-testid=page-failure]"));
        Assert.Equal("2", page.Find("#saves").TextContent);
        // A second failure is reported again.
        page.Find("#fail").Click();
        Assert.Single(page.FindAll("[data-testid=page-failure]"));
    }

    [Fact]
    public void A_refusal_by_the_domain_is_shown_in_its_own_words()
    {
        var page = Render(refused: true);
        page.Find("#fail").Click();
        string shown = page.Find("[data-testid=page-failure]").TextContent;
        Assert.Contains("Capital limit: the capital limit cannot be negative.", shown, StringComparison.Ordinal);
        Assert.DoesNotContain("capitalLimit", shown, StringComparison.Ordinal);
    }

    [Fact]
    public void A_part_that_cannot_be_drawn_is_replaced_by_the_message_without_looping()
    {
        var page = _context.Render<PageBoundary>(p => p.Add(b => b.Area, "The ranking").AddChildContent<BrokenPanel>());
        var alert = page.Find("[data-testid=page-failure]");
        Assert.Contains("The ranking could not finish:", alert.TextContent, StringComparison.Ordinal);
        Assert.DoesNotContain("What you typed is still here.", alert.TextContent, StringComparison.Ordinal);
        Assert.Single(page.FindAll("a.reload"));
    }

    [Fact]
    public async Task A_failing_action_of_the_page_itself_is_shown_and_the_page_keeps_its_state()
    {
        var page = _context.Render<FailingPage>();
        page.Find("#title").Change("Paint shop extraction, option B");
        await page.Find("#save").ClickAsync(new());

        page.WaitForAssertion(() => Assert.Contains("The proposal could not finish:", page.Find("[data-testid=page-failure]").TextContent, StringComparison.Ordinal));
        Assert.Equal("Paint shop extraction, option B", page.Find("#title").GetAttribute("value"));
        page.Find("[data-testid=page-failure-dismiss]").Click();
        Assert.Empty(page.FindAll("[data-testid=page-failure]"));
        Assert.Equal("Paint shop extraction, option B", page.Find("#title").GetAttribute("value"));
    }
}
