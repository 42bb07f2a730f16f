using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Common;
using CapReview.Reviews.Display;
using CapReview.Reviews.Proposals;

namespace CapReview.Reviews.Tests.Display;

public sealed class FieldWordingTests
{
    private static readonly ProposalAssumptions Assumptions = new()
    {
        Model = new ModelSpec
        {
            Horizon = 8,
            Elements =
            [
                new ElementSpec { Id = "press", Type = ElementKind.Single, Label = "Press", Category = CashFlowCategory.Capital, Period = 0, Amount = -90_000 },
                new ElementSpec { Id = "energy", Type = ElementKind.Geometric, Label = "Energy saving", Category = CashFlowCategory.Revenue, First = 1, Last = 8, Amount = 9_000, Growth = 0.02 },
            ],
        },
        Risk = new RiskSpec { Parameters = [new ParameterSpec { Name = "Energy price", Target = "elements[#energy].amount" }] },
    };

    [Theory]
    [InlineData("elements[3].amount", "Element 4, amount")]
    [InlineData("elements[2].expensed", "Element 3, deducted as a repair")]
    [InlineData("elements[2].depreciatedAs", "Element 3, depreciated as")]
    [InlineData("model.elements[0].last", "Element 1, last period")]
    [InlineData("risk.parameters[0].low", "Risk parameter 1, low")]
    [InlineData("risk.parameters[2].mostLikely", "Risk parameter 3, most likely")]
    [InlineData("risk.trials", "Trials")]
    [InlineData("capitalLimit", "Capital limit")]
    [InlineData("rate.value", "MARR")]
    [InlineData("tax.incomeTaxRate", "Income-tax rate")]
    [InlineData("replacement.defender[1].marketValue", "Asset in service, year 2, market value")]
    [InlineData("proposals[1].versions[0].assumptionsSha256", "Proposal 2, version 1, assumptions SHA-256")]
    public void A_field_path_reads_as_people_count_and_name_it(string path, string words) =>
        Assert.Equal(words, FieldWording.Describe(path));

    [Fact]
    public void With_the_assumptions_at_hand_an_element_and_a_parameter_are_named_by_their_label()
    {
        Assert.Equal("Element 2, ‘Energy saving’, first amount", FieldWording.Describe("model.elements[1].amount", Assumptions));
        Assert.Equal("Element 2, ‘Energy saving’, growth per period", FieldWording.Describe("elements[#energy].growth", Assumptions));
        Assert.Equal("Risk parameter 1, ‘Energy price’, low", FieldWording.Describe("risk.parameters[0].low", Assumptions));
    }

    [Fact]
    public void A_refusal_that_starts_with_a_path_keeps_it_for_programs_and_says_it_in_words()
    {
        var refused = new RuleViolationException("capitalLimit: the capital limit must be above zero.");
        Assert.Equal("Capital limit: the capital limit must be above zero.", refused.Message);
        Assert.Equal("capitalLimit", refused.Field);
        var plain = new RuleViolationException("The cycle Plan 2027 is already decided.");
        Assert.Equal("The cycle Plan 2027 is already decided.", plain.Message);
        Assert.Null(plain.Field);
    }

    [Fact]
    public void Stored_choices_read_as_words()
    {
        Assert.Equal("Cost reduction", EnumWording.Of(ProposalCategory.CostReduction));
        Assert.Equal("PERT", EnumWording.Of(DistributionKind.Pert));
        Assert.Equal("Geometric gradient", EnumWording.FromStored("type", "geometric"));
        Assert.Equal("Uniform", EnumWording.FromStored("distribution", "uniform"));
        Assert.Equal("Returned for changes", EnumWording.Of(ProposalStatus.ReturnedForChanges));
        Assert.Equal("In review", EnumWording.Of(ProposalStatus.InReview));
        Assert.Equal("several rates", EnumWording.Of(RateOfReturnKind.Several));
    }
}
