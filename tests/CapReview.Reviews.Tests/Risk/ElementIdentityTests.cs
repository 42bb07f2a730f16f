using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CapReview.Reviews.Proposals;
using CapReview.Reviews.Risk;

namespace CapReview.Reviews.Tests.Risk;

/// <summary>
/// Risk parameters name their element by its identity: reordering, inserting or deleting elements never points a
/// parameter at another element. Documents stored with positions read exactly as before.
/// </summary>
public sealed class ElementIdentityTests
{
    /// <summary>(P/A, 10 %, 10), the standard uniform-series present-worth factor.</summary>
    private static readonly double SeriesFactor = (1 - Math.Pow(1.1, -10)) / 0.1;

    private static readonly ElementSpec Plant = new() { Id = "plant", Type = ElementKind.Single, Label = "Plant", Category = CashFlowCategory.Capital, Period = 0, Amount = -400_000 };
    private static readonly ElementSpec Saving = new() { Id = "saving", Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 10, Amount = 70_000 };
    private static readonly ElementSpec Upkeep = new() { Id = "upkeep", Type = ElementKind.Uniform, Label = "Upkeep", Category = CashFlowCategory.Operating, First = 1, Last = 10, Amount = -5_000 };

    private static ModelSpec Model(params ElementSpec[] elements) => new() { Horizon = 10, Rate = new RateSpec { Value = 0.10 }, Elements = elements };

    private static RiskSpec Vary(string target) => new()
    {
        Parameters = [new ParameterSpec { Name = "Saving", Target = target, Low = 50_000, MostLikely = 70_000, High = 90_000 }],
    };

    private static double Swing(ModelSpec model, string target) =>
        Assert.Single(ProposalRisk.Analyse(ProposalRisk.Prepare(new ProposalCase(model), Vary(target)).Value!).Tornado).Swing;

    [Fact]
    public void A_parameter_keeps_its_element_when_elements_are_reordered_or_inserted()
    {
        // The saving moves by 40,000 a year: a swing of 40,000 × (P/A, 10 %, 10) whichever position it holds.
        double expected = 40_000 * SeriesFactor;
        Assert.Equal(expected, Swing(Model(Plant, Saving), "elements[#saving].amount"), 6);
        Assert.Equal(expected, Swing(Model(Saving, Plant), "elements[#saving].amount"), 6);
        Assert.Equal(expected, Swing(Model(Upkeep, Plant, Saving), "elements[#saving].amount"), 6);
        Assert.Equal(expected, Swing(Model(Plant, Upkeep, Saving), "elements[#saving].amount"), 6);
    }

    [Fact]
    public void A_parameter_whose_element_was_deleted_is_an_error_naming_the_field_not_a_retarget()
    {
        var outcome = ProposalRisk.Prepare(new ProposalCase(Model(Plant, Upkeep)), Vary("elements[#saving].amount"));
        Assert.False(outcome.IsValid);
        var error = Assert.Single(outcome.Errors);
        Assert.Equal("risk.parameters[0].target", error.Field);
        Assert.Contains("saving", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Two_elements_with_one_id_are_refused()
    {
        var outcome = Engine.Evaluation.Evaluator.Evaluate(Model(Plant, Saving, Upkeep with { Id = "saving" }));
        Assert.Equal("elements[2].id", Assert.Single(outcome.Errors).Field);
    }

    [Fact]
    public void A_document_stored_with_positions_reads_and_hashes_exactly_as_before()
    {
        // A version's canonical JSON as written before identities: no ids, the parameter naming element 1 by position.
        const string stored = """{"model":{"horizon":10,"rate":{"value":0.1},"elements":[{"type":"single","label":"Plant","category":"capital","period":0,"amount":-400000},{"type":"uniform","label":"Saving","category":"revenue","first":1,"last":10,"amount":70000}]},"risk":{"parameters":[{"name":"Saving","target":"elements[1].amount","low":50000,"mostLikely":70000,"high":90000}]}}""";
        var assumptions = AssumptionsDocument.Deserialize(stored);
        Assert.Equal(stored, AssumptionsDocument.Serialize(assumptions));
        // Outside reference: SHA-256 of the UTF-8 text, computed here with System.Security.Cryptography.
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(System.Text.Encoding.UTF8.GetBytes(stored))),
            AssumptionsDocument.Hash(AssumptionsDocument.Serialize(assumptions)));
        var study = ProposalRisk.Prepare(new ProposalCase(assumptions.Model), assumptions.Risk!).Value!;
        Assert.Equal(40_000 * SeriesFactor, Assert.Single(ProposalRisk.Analyse(study).Tornado).Swing, 6);
    }

    [Fact]
    public void Stamping_gives_ids_and_points_positional_parameters_at_the_same_elements()
    {
        var legacy = new ProposalAssumptions
        {
            Model = Model(Plant with { Id = null }, Saving with { Id = null }),
            Risk = Vary("elements[1].amount"),
        };
        var stamped = ElementIdentities.Stamp(legacy);
        Assert.Equal(["e1", "e2"], stamped.Model.Elements!.Select(e => e!.Id));
        Assert.Equal("elements[#e2].amount", stamped.Risk!.Parameters![0]!.Target);
        // Deterministic, so a stored document stamped twice gives the same text; already stamped, it is left alone.
        Assert.Equal(AssumptionsDocument.Serialize(stamped), AssumptionsDocument.Serialize(ElementIdentities.Stamp(legacy)));
        Assert.Same(stamped, ElementIdentities.Stamp(stamped));

        // Now reordering cannot retarget it.
        var reordered = stamped with { Model = stamped.Model with { Elements = [.. stamped.Model.Elements!.Reverse()] } };
        Assert.Equal(40_000 * SeriesFactor, Swing(reordered.Model, reordered.Risk!.Parameters![0]!.Target!), 6);
    }

    [Fact]
    public void A_positional_parameter_beyond_the_elements_stays_positional_and_is_named()
    {
        var stamped = ElementIdentities.Stamp(new ProposalAssumptions { Model = Model(Plant with { Id = null }), Risk = Vary("elements[3].amount") });
        Assert.Equal("elements[3].amount", stamped.Risk!.Parameters![0]!.Target);
        var outcome = ProposalRisk.Prepare(new ProposalCase(stamped.Model), stamped.Risk);
        Assert.Equal("risk.parameters[0].target", Assert.Single(outcome.Errors).Field);
    }

    [Fact]
    public void An_input_is_labelled_by_its_element_wherever_it_stands()
    {
        Assert.Equal("2. Saving: amount", RiskInputs.Label("elements[#saving].amount", Model(Plant, Saving), null));
        Assert.Equal("1. Saving: amount", RiskInputs.Label("elements[#saving].amount", Model(Saving, Plant), null));
        Assert.Equal("2. Saving: amount", RiskInputs.Label("elements[1].amount", Model(Plant with { Id = null }, Saving with { Id = null }), null));
        Assert.Equal("MARR", RiskInputs.Label("rate", Model(Plant), null));
        Assert.Equal("elements[#gone].amount", RiskInputs.Label("elements[#gone].amount", Model(Plant), null));
    }
}
