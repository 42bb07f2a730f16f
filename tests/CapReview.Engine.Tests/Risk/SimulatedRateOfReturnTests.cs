using CapReview.Engine.CashFlows;
using CapReview.Engine.Measures;
using CapReview.Engine.Rates;
using CapReview.Engine.Risk;
using CapReview.Engine.Specifications;

namespace CapReview.Engine.Tests.Risk;

/// <summary>
/// A simulation keeps only a unique rate of return and stops each trial's search at a second root: its figures must be
/// the ones the full search gave (the full search is the reference; its roots are checked against outside sources in
/// RateOfReturnSearchTests).
/// </summary>
public class SimulatedRateOfReturnTests
{
    // An invented quarry: opening, fifteen years of receipts, an extension in year 8 and the site's restoration at the
    // end: four sign changes; most trials have two rates of return, some one, some none.
    internal static readonly ProposalCase Quarry = new(new ModelSpec
    {
        Horizon = 15,
        Rate = new RateSpec { Value = 0.08 },
        Elements =
        [
            new ElementSpec { Type = ElementKind.Single, Label = "Opening", Category = CashFlowCategory.Capital, Period = 0, Amount = -1_000_000 },
            new ElementSpec { Type = ElementKind.Uniform, Label = "Stone sold", Category = CashFlowCategory.Revenue, First = 1, Last = 15, Amount = 250_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Extension", Category = CashFlowCategory.Capital, Period = 8, Amount = -600_000 },
            new ElementSpec { Type = ElementKind.Single, Label = "Restoration", Category = CashFlowCategory.Operating, Period = 15, Amount = -2_500_000 },
        ],
    });

    internal static readonly UncertainParameter[] Parameters =
    [
        new("Stone sold", "elements[1].amount", 200_000, 250_000, 320_000),
        new("Extension", "elements[2].amount", -800_000, -600_000, -400_000, DistributionKind.Pert),
        new("Restoration", "elements[3].amount", -3_500_000, -1_500_000, -150_000, DistributionKind.Lognormal),
        new("MARR", "rate", 0.06, 0.08, 0.10, DistributionKind.Normal),
    ];

    [Fact]
    public void Each_trial_gets_the_rate_the_full_search_gives_its_flows()
    {
        var compiled = CompiledTrials.TryCompile(Quarry, Parameters)!;
        var space = compiled.NewWorkspace();
        var samplers = Parameters.Select(p => new Sampler(p)).ToArray();
        var random = new Random(2027);
        int several = 0, unique = 0;
        for (int t = 0; t < 5_000; t++)
        {
            double[] values = [.. samplers.Select(s => s.Draw(random))];
            double ror = compiled.Run(values, space).Ror;
            // The flows the trial left in the workspace, searched in full.
            var full = RateOfReturnSearch.Find(space.Flows, RateOfReturnSearch.LowestAnnual, RateOfReturnSearch.HighestAnnual);
            double expected = full.UniqueRoot is double r ? AnnualRate.AnnualEffectiveFromPeriod(r, 1) : double.NaN;
            Assert.Equal(BitConverter.DoubleToInt64Bits(expected), BitConverter.DoubleToInt64Bits(ror));
            several += full.Roots.Count > 1 ? 1 : 0;
            unique += full.Roots.Count == 1 ? 1 : 0;
        }
        // The trials exercise the early stop: most have several roots.
        // The trials exercise both answers: of 5,000, 3,828 have several roots and 697 one (counted with the full search).
        Assert.Equal((3_828, 697), (several, unique));
    }

    [Fact]
    public void The_same_seed_gives_the_figures_the_full_search_gave()
    {
        // Figures of this run (20,000 trials, seed 2027) recorded with the full search, before the search stopped at a
        // second root (2,825 trials with a unique rate): PW, AW and the rate of return must not move by a bit.
        var result = MonteCarlo.Run(Quarry, Parameters, 20_000, seed: 2027);
        string actual = string.Join(" ", new[] { result.PresentWorth, result.AnnualWorth, result.RateOfReturn }
            .SelectMany(s => new[] { s.Mean, s.StandardDeviation, s.P5, s.P50, s.P95, s.Count })
            .Select(v => v.ToString("R", System.Globalization.CultureInfo.InvariantCulture)));
        Assert.Equal("517111.549848029 502528.3518151867 -247298.15830697783 585751.1026676629 1084399.200597239 20000 "
            + "60086.88695304005 57426.75144942104 -28846.409259258508 68871.76935514958 124087.21369554027 20000 "
            + "0.21714039331948448 0.0303684895248438 0.16647934633752262 0.21650230610333096 0.2669858881321638 2825", actual);
    }
}
