using CapReview.Engine.CashFlows;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Proposals;
using CapReview.Web.Components.Evaluation;

namespace CapReview.Web.Tests.Components;

public sealed class VersionDifferenceTableTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    public void Dispose() => _context.Dispose();

    private static ModelSpec Model(double saving, bool reversed = false, bool extra = false)
    {
        ElementSpec press = new() { Id = "press", Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -200_000 };
        ElementSpec staff = new() { Id = "staff", Type = ElementKind.Uniform, Label = "Two operator positions saved", Category = CashFlowCategory.Revenue, First = 1, Last = 5, Amount = saving };
        List<ElementSpec?> elements = reversed ? [staff, press] : [press, staff];
        if (extra)
        {
            elements.Add(new ElementSpec { Id = "resale", Type = ElementKind.Single, Label = "Resale", Category = CashFlowCategory.Salvage, Period = 5, Amount = 20_000 });
        }
        return new ModelSpec { PeriodsPerYear = 1, Horizon = 5, Elements = elements };
    }

    private static VersionView Version(int number, ModelSpec model) =>
        new(number, "lead", DateTimeOffset.UnixEpoch, "why", true, DateTimeOffset.UnixEpoch, new string('a', 64), new ProposalAssumptions { Model = model });

    private IRenderedComponent<VersionDifferenceTable> Render(params VersionView[] versions) =>
        _context.Render<VersionDifferenceTable>(p => p
            .Add(c => c.Proposal, new ProposalView(1, "P-0001", "lead", "Press line", "", ProposalCategory.CostReduction, Reviews.Proposals.RiskClass.Standard,
                ProposalStatus.Draft, null, 1, versions))
            .Add(c => c.MarrPercent, 10));

    [Fact]
    public void A_changed_amount_reads_in_words_in_the_editors_numbering_with_its_effect_on_present_worth()
    {
        var table = Render(Version(1, Model(78_000)), Version(2, Model(39_000)));
        var row = Assert.Single(table.FindAll("[data-testid=version-change]"));
        var cells = row.QuerySelectorAll("td").Select(c => c.TextContent).ToList();
        Assert.Equal("Element 2, ‘Two operator positions saved’", cells[0]);
        Assert.Equal("amount each period", cells[1]);
        Assert.Equal("78,000", cells[2]);
        Assert.Equal("39,000", cells[3]);
        // A uniform series' present worth at 10 %: A × (1 − 1.1⁻⁵) / 0.1 (the uniform-series present-worth factor), so
        // halving 78,000 to 39,000 costs 39,000 × 3.790787 = 147,840.68.
        double factor = (1 - Math.Pow(1.1, -5)) / 0.1;
        Assert.Equal("\u2212" + Math.Round(39_000 * factor, MidpointRounding.AwayFromZero).ToString("#,##0", System.Globalization.CultureInfo.InvariantCulture), cells[4]);
        Assert.Equal("\u2212147,841", cells[4]);
        Assert.Contains("Element 2, ‘Two operator positions saved’: amount each period 78,000 → 39,000", row.GetAttribute("title"), StringComparison.Ordinal);
        Assert.DoesNotContain("elements[", table.Markup, StringComparison.Ordinal);
        Assert.DoesNotContain("model.", table.Markup, StringComparison.Ordinal);
        Assert.Contains("every other change", table.Find("[data-testid=version-effect-note]").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void Reordered_elements_are_no_change_and_an_added_one_is_named_with_its_worth()
    {
        Assert.Contains("No field differs.", Render(Version(1, Model(78_000)), Version(2, Model(78_000, reversed: true))).Markup, StringComparison.Ordinal);

        var table = Render(Version(1, Model(78_000)), Version(2, Model(78_000, extra: true)));
        var cells = Assert.Single(table.FindAll("[data-testid=version-change]")).QuerySelectorAll("td").Select(c => c.TextContent).ToList();
        Assert.Equal(["Element 3, ‘Resale’", "added"], cells.Take(2));
        // 20,000 in year 5 at 10 %: 20,000 / 1.1⁵ = 12,418.43.
        Assert.Equal("12,418", cells[4]);
    }
}
