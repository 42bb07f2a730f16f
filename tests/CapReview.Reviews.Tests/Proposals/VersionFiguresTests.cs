using CapReview.Engine.CashFlows;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Marr;
using CapReview.Reviews.Proposals;
using Microsoft.VisualBasic;

namespace CapReview.Reviews.Tests.Proposals;

/// <summary>The figures of a version, gathered once by the domain for its packet and its exports.</summary>
public sealed class VersionFiguresTests
{
    private static readonly MarrPolicyVersion Policy = new(1, new NewMarrPolicy(0.10, RateBasis.Effective, 1, new DateOnly(2027, 1, 1), "Figures"), "admin-1", default);

    private static VersionView Version(int number, double saving, TaxSpec? tax = null) => new(number, "lead-1", DateTimeOffset.UnixEpoch, number == 1 ? "First draft" : "Re-measured",
        true, DateTimeOffset.UnixEpoch, new string('0', 64), new ProposalAssumptions
        {
            Model = new ModelSpec
            {
                Horizon = 5,
                Elements =
                [
                    new ElementSpec { Id = "e1", Type = ElementKind.Single, Label = "Heat exchanger", Category = CashFlowCategory.Capital, Period = 0, Amount = -10_000 },
                    new ElementSpec { Id = "e2", Type = ElementKind.Uniform, Label = "Gas saved", Category = CashFlowCategory.Operating, First = 1, Last = 5, Amount = saving },
                ],
            },
            Tax = tax,
        });

    private static ProposalView Proposal(params VersionView[] versions) => new(7, "P-0007", "lead-1", "Heat recovery", "", ProposalCategory.CostReduction,
        RiskClass.Standard, ProposalStatus.Approved, 1, 4, versions);

    [Fact]
    public void A_versions_figures_hold_its_measures_flows_and_changes_at_the_boards_marr()
    {
        var v1 = Version(1, 2_800);
        var v2 = Version(2, 3_000, new TaxSpec { IncomeTaxRate = 0.25, Depreciation = new DepreciationSpec { Method = DepreciationMethod.StraightLine, Life = 5 } });
        VersionFigures figures = VersionFigures.Of(Proposal(v1, v2), v2, Policy, studyPeriodYears: null, simulate: false);

        // −10,000 + 3,000 × (P/A, 10 %, 5): Microsoft.VisualBasic.Financial.PV.
        double expected = -10_000 - Financial.PV(0.10, 5, 3_000);
        Assert.Equal(expected, figures.Evaluation!.PresentWorth, 8);
        Assert.Equal(6, figures.Periods.Count);
        Assert.Equal(expected, figures.Periods[^1].CumulativePresentWorth, 8);
        Assert.Equal(-10_000, figures.ElementWorths[0], 8);
        Assert.Equal(expected + 10_000, figures.ElementWorths[1], 8);
        // Version 1 to version 2: the saving and the tax settings changed.
        var change = Assert.Single(figures.Changes);
        Assert.Equal((1, 2), (change.From, change.To));
        Assert.Contains(change.Fields, f => f.Path == "model.elements[1].amount" && f.Before == "2800" && f.After == "3000");
        // Straight line over five years, nothing left at disposal (common practice, no source).
        Assert.NotNull(figures.AfterTax!.Value);
        Assert.Equal([2_000, 2_000, 2_000, 2_000, 2_000], figures.Depreciation!.Amounts.Select(a => Math.Round(a, 6)));
        Assert.Null(figures.Risk);
        Assert.Null(figures.Simulation);
        Assert.Null(figures.StudyPeriod);
    }

    [Fact]
    public void A_study_period_gives_the_worth_over_the_boards_years_and_an_incomplete_model_gives_no_figures()
    {
        var v1 = Version(1, 3_000);
        VersionFigures study = VersionFigures.Of(Proposal(v1), v1, Policy, studyPeriodYears: 3, simulate: false);
        // Three years of the five-year life, with no value stated at the study's end: −10,000 + 3,000 × (P/A, 10 %, 3).
        Assert.Equal(-10_000 - Financial.PV(0.10, 3, 3_000), study.StudyPeriod!.PresentWorth, 6);

        var incomplete = v1 with { Assumptions = v1.Assumptions with { Model = v1.Assumptions.Model with { Horizon = null } } };
        VersionFigures none = VersionFigures.Of(Proposal(incomplete), incomplete, Policy, studyPeriodYears: null, simulate: false);
        Assert.Null(none.Evaluation);
        Assert.Empty(none.Periods);
        Assert.Empty(none.ElementWorths);
    }
}
