using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Specifications;

public class ElementIdentityTests
{
    private static ModelSpec Model(string? firstId = "cost", string? secondId = "saving") => new()
    {
        Horizon = 8,
        Rate = new RateSpec { Value = 0.08 },
        Elements =
        [
            new ElementSpec { Id = firstId, Type = ElementKind.Single, Label = "Cost", Category = CashFlowCategory.Capital, Period = 0, Amount = -50_000 },
            new ElementSpec { Id = secondId, Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 8, Amount = 10_000 },
        ],
    };

    [Theory]
    [InlineData("", "elements[0].id")]
    [InlineData("has space", "elements[0].id")]
    [InlineData("saving", "elements[1].id")]
    public void A_blank_malformed_or_repeated_id_is_named(string id, string field)
    {
        var outcome = Evaluator.Evaluate(Model(firstId: id));
        Assert.Equal(field, Assert.Single(outcome.Errors).Field);
    }

    [Fact]
    public void Ids_change_no_figure()
    {
        // Common practice, no source: an identity is bookkeeping, so the measures with and without ids are equal.
        Assert.Equal(Evaluator.Evaluate(Model(null, null)).Value!.PresentWorth, Evaluator.Evaluate(Model()).Value!.PresentWorth);
    }

    [Fact]
    public void A_target_by_identity_resolves_to_the_element_wherever_it_stands()
    {
        Assert.Equal("elements[1].amount", ElementIdentity.Resolve("elements[#saving].amount", Model().Elements));
        Assert.Equal("elements[0].amount", ElementIdentity.Resolve("elements[#saving].amount", [.. Model().Elements!.Reverse()]));
        Assert.Null(ElementIdentity.Resolve("elements[#gone].amount", Model().Elements));
        Assert.Equal("rate", ElementIdentity.Resolve("rate", Model().Elements));
        Assert.Equal(10_000, new ProposalCase(Model()).ValueAt("elements[#saving].amount"));
        Assert.False(new ProposalCase(Model()).CanVary("elements[#gone].amount"));
    }

    [Fact]
    public void The_simulation_by_identity_draws_exactly_what_it_draws_by_position()
    {
        // The compiled fast path reads identity targets too: the same seed gives the same trials either way.
        var proposal = new ProposalCase(Model());
        var (byPosition, _, _) = MonteCarlo.Simulate(proposal, [new UncertainParameter("Saving", "elements[1].amount", 6_000, 10_000, 12_000)], 3_000, 9);
        var (byIdentity, _, _) = MonteCarlo.Simulate(proposal, [new UncertainParameter("Saving", "elements[#saving].amount", 6_000, 10_000, 12_000)], 3_000, 9);
        Assert.Equal(byPosition, byIdentity);
    }
}
