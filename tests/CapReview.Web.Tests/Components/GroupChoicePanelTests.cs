using CapReview.Engine.CashFlows;
using CapReview.Engine.Comparison;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Portfolio;
using CapReview.Web.Components.Portfolio;

namespace CapReview.Web.Tests.Components;

/// <summary>The ranking page's group panel says which horizon its incremental analysis compares over.</summary>
public sealed class GroupChoicePanelTests : IDisposable
{
    private readonly BunitContext _context = ComponentTestContext.Create();

    private static Alternative Way(string name, double firstCost, double yearly, int life, double atEnd) => new(name,
        SpecificationReader.Read(new ModelSpec
        {
            Horizon = life,
            Rate = new RateSpec { Value = 0.08 },
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Labeller", Category = CashFlowCategory.Capital, Period = 0, Amount = -firstCost },
                new ElementSpec { Type = ElementKind.Uniform, Label = "Labels sold", Category = CashFlowCategory.Revenue, First = 1, Last = life, Amount = yearly },
            ],
        }).Value!.Model, atEnd);

    private static GroupAnalysis Labelling(int? studyPeriodYears) => new(new ExclusiveGroup { Name = "Labelling" }, AnnualRate.Effective(0.08),
        "the MARR of its proposals",
        ExclusiveChoice.Decide([Way("P-0001", 40_000, 18_000, 3, 20_000), Way("P-0002", 70_000, 17_000, 6, 30_000)], AnnualRate.Effective(0.08), false, studyPeriodYears),
        null);

    [Fact]
    public void The_panel_names_the_study_period_when_the_cycle_has_one_and_the_common_multiple_otherwise()
    {
        var study = _context.Render<GroupChoicePanel>(p => p.Add(x => x.Analyses, [Labelling(4)]));
        Assert.StartsWith("Compared over: each alternative over the cycle's study period of 4 years (4 periods)", study.Find("[data-testid=group-basis]").TextContent.Trim(), StringComparison.Ordinal);
        Assert.Contains("by the incremental analysis P-0002", study.Find("[data-testid=group-choice]").TextContent, StringComparison.Ordinal);

        var lives = _context.Render<GroupChoicePanel>(p => p.Add(x => x.Analyses, [Labelling(null)]));
        Assert.Equal("Compared over: each alternative renewed like for like over the least common multiple of the lives (6 periods).",
            lives.Find("[data-testid=group-basis]").TextContent.Trim());
        Assert.Contains("by the incremental analysis P-0001", lives.Find("[data-testid=group-choice]").TextContent, StringComparison.Ordinal);
    }

    public void Dispose() => _context.Dispose();
}
