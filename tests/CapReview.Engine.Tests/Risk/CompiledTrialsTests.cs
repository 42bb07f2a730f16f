using CapReview.Engine.CashFlows;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;
using CsCheck;

namespace CapReview.Engine.Tests.Risk;

public class CompiledTrialsTests
{
    private static readonly ProposalCase Line = new(new ModelSpec
    {
        Horizon = 20,
        Rate = new RateSpec { Value = 0.09 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Line", Category = CashFlowCategory.Capital, Period = 0, Amount = -900_000 },
            new ElementSpec { Type = ElementKind.Geometric, Label = "Output", Category = CashFlowCategory.Revenue, First = 1, Last = 20, Amount = 110_000, Growth = 0.02 },
            new ElementSpec { Type = ElementKind.Arithmetic, Label = "Upkeep", Category = CashFlowCategory.Operating, First = 2, Last = 20, Amount = -8_000, Step = -400 },
            new ElementSpec { Type = ElementKind.Recurring, Label = "Rebuild", Category = CashFlowCategory.Capital, First = 7, Last = 14, Every = 7, Amount = -60_000 },
        ],
    });

    private static readonly UncertainParameter[] Parameters =
    [
        new("Line", "elements[0].amount", -1_000_000, -900_000, -850_000),
        new("Output", "elements[1].amount", 90_000, 110_000, 125_000),
        new("Output growth", "elements[1].growth", 0.0, 0.02, 0.04),
        new("Upkeep step", "elements[2].step", -800, -400, 0),
        new("Rebuild", "elements[3].amount", -90_000, -60_000, -50_000),
        new("Output ends", "elements[1].last", 15, 20, 20),
        new("MARR", "rate", 0.06, 0.09, 0.14),
    ];

    [Fact]
    public void The_fast_path_gives_what_the_full_evaluation_of_the_entered_specification_gives() =>
        // The identity that makes the fast path safe: same draws, same PW, AW and rate of return; no source.
        Gen.Double[0, 1].Array[Parameters.Length].Sample(shares =>
        {
            double[] values = [.. Parameters.Select((p, k) => p.Low + (p.High - p.Low) * shares[k])];
            var compiled = CompiledTrials.TryCompile(Line, Parameters)!;
            var fast = compiled.Run(values, compiled.NewWorkspace());
            var full = MonteCarlo.Full(Line, Parameters, values);
            static bool Same(double a, double b) => (double.IsNaN(a) && double.IsNaN(b)) || Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Abs(b));
            return Same(fast.Pw, full.Item1) && Same(fast.Aw, full.Item2) && Same(fast.Ror, full.Item3);
        });

    [Fact]
    public void Taxed_proposals_and_other_inputs_take_the_full_path()
    {
        Assert.Null(CompiledTrials.TryCompile(Line with { Tax = new TaxSpec() }, Parameters));
        Assert.Null(CompiledTrials.TryCompile(Line, [new("Life", "horizon", 15, 20, 25)]));
        Assert.NotNull(CompiledTrials.TryCompile(Line, Parameters));
    }

    [Fact]
    public void A_drawn_MARR_below_the_entry_bound_is_invalid_on_both_paths()
    {
        // The fast path holds a drawn MARR to the bound the entered one is held to (docs/methods.md, "Limits of the
        // input"), as the full path does through the specification reader: −50% is refused by both, −40% by neither.
        UncertainParameter[] marr = [new("MARR", "rate", -0.6, 0.09, 0.14)];
        var compiled = CompiledTrials.TryCompile(Line, marr)!;
        Assert.True(double.IsNaN(compiled.Run([-0.5], compiled.NewWorkspace()).Pw));
        Assert.True(double.IsNaN(MonteCarlo.Full(Line, marr, [-0.5]).Item1));
        Assert.True(double.IsFinite(compiled.Run([-0.4], compiled.NewWorkspace()).Pw));
        Assert.True(double.IsFinite(MonteCarlo.Full(Line, marr, [-0.4]).Item1));
    }

    [Fact]
    public void Parameter_values_past_the_largest_flow_are_refused_by_name()
    {
        var read = RiskSpecReader.Read(new RiskSpec { Parameters = [new ParameterSpec { Name = "Line", Target = "elements[0].amount", Low = -1e300, MostLikely = -900_000, High = 0 }] }, Line);
        Assert.Equal("risk.parameters[0].low", Assert.Single(read.Errors).Field);
    }

    [Fact]
    public void A_draw_that_makes_no_valid_model_is_counted_as_invalid()
    {
        var result = MonteCarlo.Run(Line, [new("Output ends", "elements[1].last", 15, 20, 30, DistributionKind.Uniform)], 1_000, 3);
        Assert.InRange(result.Invalid, 300, 700);
    }
}
