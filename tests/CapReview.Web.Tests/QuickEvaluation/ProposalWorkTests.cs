using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Web.ProposalForms;
using CapReview.Web.QuickEvaluation;

namespace CapReview.Web.Tests.QuickEvaluation;

/// <summary>The editor's typed work, written and read back as the unsaved-work copy: every part comes back as typed.</summary>
public class ProposalWorkTests
{
    [Fact]
    public void Every_part_of_the_typed_work_comes_back_as_typed()
    {
        var form = new ProposalForm { Title = "Kiln burners", ChangeReason = "Gas price", OverrideMarr = true, OverridePercent = 11.5, StudyEndValue = "12,5x" };
        form.Tax.Enabled = true;
        form.Tax.IncomeTaxPercent = "27";
        form.Tax.Credits.Add(new CreditDraft { Year = "2", Amount = "4000" });
        form.Risk.Parameters.Add(new ParameterDraft { Name = "Gas", Target = "elements[#e2].amount", Low = "1", MostLikely = "", High = "abc", Distribution = DistributionKind.Pert });
        form.Risk.Correlations.Add(new CorrelationDraft { First = "Gas", Second = "Gas", Coefficient = "0.4" });
        var scenario = new ScenarioDraft { Name = "Dry year" };
        scenario.Values["Gas"] = "-3";
        form.Risk.Scenarios.Add(scenario);
        form.Replacement.Defender.Add(new ServiceYearDraft { MarketValue = "900", OperatingCost = "12" });
        var model = new ModelDraft { Horizon = "12", MarrPercent = "9" };
        model.Elements.Add(new ElementDraft { Id = "e2", Type = ElementKind.Geometric, Label = "Gas saved", Amount = "41 5", GrowthPercent = "3" });

        string written = ProposalWork.Write(form, model);
        var back = ProposalWork.Read(written)!;

        Assert.Equal("Kiln burners", back.Form.Title);
        Assert.Equal("Gas price", back.Form.ChangeReason);
        Assert.Equal(11.5, back.Form.OverridePercent);
        Assert.Equal("12,5x", back.Form.StudyEndValue);
        Assert.True(back.Form.Tax.Enabled);
        Assert.Equal("27", back.Form.Tax.IncomeTaxPercent);
        Assert.Equal("4000", Assert.Single(back.Form.Tax.Credits).Amount);
        var parameter = Assert.Single(back.Form.Risk.Parameters);
        Assert.Equal(("elements[#e2].amount", "1", "", "abc", DistributionKind.Pert), (parameter.Target, parameter.Low, parameter.MostLikely, parameter.High, parameter.Distribution));
        Assert.Equal("0.4", Assert.Single(back.Form.Risk.Correlations).Coefficient);
        Assert.Equal("-3", Assert.Single(back.Form.Risk.Scenarios).Values["Gas"]);
        Assert.Equal("900", Assert.Single(back.Form.Replacement.Defender).MarketValue);
        var element = Assert.Single(back.Model.Elements);
        Assert.Equal(("e2", ElementKind.Geometric, "Gas saved", "41 5", "3"), (element.Id, element.Type, element.Label, element.Amount, element.GrowthPercent));
        Assert.Equal("12", back.Model.Horizon);
        // Read back, the work compares equal to what was written: recovering and changing nothing is no change.
        Assert.Equal(written, ProposalWork.Write(back.Form, back.Model));
    }

    [Theory]
    [InlineData("not json")]
    [InlineData("{\"Form\": 3}")]
    public void A_copy_that_is_not_the_editors_work_reads_as_none(string text) => Assert.Null(ProposalWork.Read(text));
}
