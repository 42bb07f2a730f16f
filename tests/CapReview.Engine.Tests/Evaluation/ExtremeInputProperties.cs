using System.Globalization;
using CapReview.Engine.CashFlows;
using CapReview.Engine.Evaluation;
using CapReview.Engine.Inflation;
using CapReview.Engine.Rates;
using CapReview.Engine.Specifications;
using CsCheck;

namespace CapReview.Engine.Tests.Evaluation;

/// <summary>
/// Extreme but valid input, generated: MARRs at the −40% bound and just above it, exactly 0, vanishingly small (down to
/// the smallest double) either side of 0, and at 1000%; horizons of 1 and 1,200 periods of a day or a year; amounts at
/// ±10^12 and as small as a double goes; growth near −100% and at 1000%; constant money escalated at the limits from a
/// base year up to 100. Every measure is a finite number or null with its reason (docs/api.md: "never infinite or
/// NaN"); the engine never throws. Finite-or-null is the property; the values themselves are checked elsewhere
/// against outside sources.
/// </summary>
public class ExtremeInputProperties
{
    private static readonly Gen<double> Rate = Gen.OneOf(
        Gen.Const(0.0), Gen.Const(-0.0), Gen.Const(MarrBounds.LowestEffectiveAnnual), Gen.Const(10.0), Gen.Const(double.Epsilon), Gen.Const(-double.Epsilon),
        Gen.Double[-0.4, -0.399], Gen.Double[-1e-9, 1e-9], Gen.Double[-0.4, 10.0],
        Gen.Int[1, 323].Select(k => Math.Pow(10, -k)), Gen.Int[1, 323].Select(k => -Math.Pow(10, -k)));

    private static readonly Gen<double> Amount = Gen.OneOf(
        Gen.Const(1e12), Gen.Const(-1e12), Gen.Const(double.Epsilon), Gen.Const(-1e-300), Gen.Double[-1e12, 1e12], Gen.Const(0.0));

    private static readonly Gen<int> Horizon = Gen.OneOf(Gen.Const(1), Gen.Const(2), Gen.Const(1200), Gen.Int[1, 1200]);

    private static readonly Gen<int> PeriodsPerYear = Gen.OneOf(Gen.Const(1), Gen.Const(12), Gen.Const(365), Gen.Int[1, 365]);

    private static Gen<ElementSpec> Element(int horizon)
    {
        var span = Gen.Select(Gen.Int[0, horizon], Gen.Int[0, horizon]).Select(p => (First: Math.Min(p.Item1, p.Item2), Last: Math.Max(p.Item1, p.Item2)));
        var category = Gen.Enum<CashFlowCategory>();
        var growth = Gen.OneOf(Gen.Const(10.0), Gen.Const(-0.999999999), Gen.Double[-0.999999, 10.0], Gen.Const(0.0));
        var escalation = Gen.OneOf(Gen.Const(10.0), Gen.Const(-0.999999999), Gen.Double[-0.99, 10.0], Gen.Const(0.0));
        var plain = Gen.OneOf(
            Gen.Select(category, Gen.Int[0, horizon], Amount, (c, t, a) => new ElementSpec { Type = ElementKind.Single, Label = "single", Category = c, Period = t, Amount = a }),
            Gen.Select(category, span, Amount, (c, s, a) => new ElementSpec { Type = ElementKind.Uniform, Label = "uniform", Category = c, First = s.First, Last = s.Last, Amount = a }),
            Gen.Select(category, span, Amount, Amount, (c, s, a, g) => new ElementSpec { Type = ElementKind.Arithmetic, Label = "arithmetic", Category = c, First = s.First, Last = s.Last, Amount = a, Step = g }),
            Gen.Select(category, span, Amount, growth, (c, s, a, g) => new ElementSpec { Type = ElementKind.Geometric, Label = "geometric", Category = c, First = s.First, Last = s.Last, Amount = a, Growth = g }),
            Gen.Select(category, span, Amount, Gen.Int[1, 1200], (c, s, a, k) => new ElementSpec { Type = ElementKind.Recurring, Label = "recurring", Category = c, First = s.First, Last = s.Last, Every = k, Amount = a }));
        return Gen.Select(plain, Gen.Bool, escalation, (e, constant, x) => constant ? e with { Money = MoneyBasis.Constant, Escalation = x } : e);
    }

    private static readonly Gen<ModelSpec> Models =
        Gen.Select(Horizon, PeriodsPerYear).SelectMany(hp => Gen.Select(
            Element(hp.Item1).Array[1, 6], Rate, Gen.Enum<RateBasis>(), Gen.OneOf(Gen.Const(1), Gen.Const(8760), Gen.Int[1, 8760]),
            Gen.OneOf(Gen.Const((InflationSpec?)null), Gen.Select(Gen.Double[-0.9, 10.0], Gen.Int[0, 100], Gen.Bool,
                (f, b, real) => (InflationSpec?)new InflationSpec { Rate = f, BaseYear = b, RealMarr = real })),
            (elements, rate, basis, m, inflation) => new ModelSpec
            {
                Horizon = hp.Item1,
                PeriodsPerYear = hp.Item2,
                Rate = new RateSpec { Value = rate, Basis = basis, CompoundingsPerYear = basis == RateBasis.Nominal ? m : null },
                Elements = elements,
                Inflation = inflation,
            }));

    [Fact]
    public void Every_measure_of_an_extreme_model_is_finite_or_null_with_its_reason()
    {
        int evaluated = 0;
        Models.Sample(spec =>
        {
            var outcome = Evaluator.Evaluate(spec);
            if (outcome.Value is not { } e)
            {
                // Refused input names its field; it never throws.
                Assert.All(outcome.Errors, error => Assert.False(string.IsNullOrWhiteSpace(error.Field)));
                return;
            }
            evaluated++;
            AssertFiniteOrExplained(e);
        }, iter: 3000);
        Assert.True(evaluated > 500, $"Only {evaluated} of 3,000 generated models were valid: the generator barely reached the measures.");
    }

    [Fact]
    public void At_any_rate_above_minus_100_percent_the_evaluation_is_finite_or_refused_naming_the_rate()
    {
        // Rates the entry bound keeps out but a what-if shift or a drawn parameter can reach: per period, from just
        // above −100% to 1000%.
        var perPeriod = Gen.OneOf(Gen.Int[1, 52].Select(k => -1 + Math.Pow(2, -k)), Gen.Double[-0.999, 10.0], Gen.Const(0.0));
        Gen.Select(Models, perPeriod).Sample((spec, i) =>
        {
            if (SpecificationReader.Read(spec).Value is not { } read)
            {
                return;
            }
            double annual = AnnualRate.AnnualEffectiveFromPeriod(i, read.Model.PeriodsPerYear);
            if (AnnualRate.Check(annual, RateBasis.Effective, 1, "rate").Count > 0)
            {
                return;
            }
            var outcome = ModelEvaluator.TryEvaluate(read.Model, new EvaluationOptions(AnnualRate.Effective(annual)));
            if (outcome.Value is { } e)
            {
                AssertFiniteOrExplained(e);
            }
            else
            {
                Assert.Equal("rate.value", Assert.Single(outcome.Errors).Field);
            }
        }, iter: 2000);
    }

    [Theory]
    [InlineData(1, 1200)]
    [InlineData(12, 1200)]
    [InlineData(365, 1)]
    public void A_MARR_of_exactly_zero_gives_the_closed_form_limits(int periodsPerYear, int horizon)
    {
        // At i = 0 the worth is the plain sum of the flows and the worth per period that sum over n: the factors'
        // closed-form limits, (P/F) = 1 and (A/P) = 1/n (common practice, no source).
        var spec = new ModelSpec
        {
            Horizon = horizon,
            PeriodsPerYear = periodsPerYear,
            Rate = new RateSpec { Value = 0.0 },
            Elements =
            [
                new ElementSpec { Type = ElementKind.Single, Label = "Cost", Category = CashFlowCategory.Capital, Period = 0, Amount = -1e12 },
                new ElementSpec { Type = ElementKind.Arithmetic, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = horizon, Amount = 1e12, Step = 1e9 },
            ],
        };
        var e = Evaluator.Evaluate(spec).Value!;
        double n = horizon;
        double sum = -1e12 + n * 1e12 + 1e9 * n * (n - 1) / 2;
        Assert.Equal(sum, e.PresentWorth, sum * 1e-14);
        Assert.Equal(sum / n, e.PeriodWorth, Math.Abs(sum / n) * 1e-14);
        Assert.Equal(sum * periodsPerYear / n, e.AnnualWorth, Math.Abs(sum * periodsPerYear / n) * 1e-13);
        Assert.Null(e.CapitalizedWorth);
        Assert.Equal(UnavailableMeasures.CapitalizedNeedsPositiveMarr, e.Unavailable[UnavailableMeasures.CapitalizedWorth]);
    }

    [Theory]
    [InlineData(1e-300)]
    [InlineData(5e-324)]
    [InlineData(-1e-200)]
    public void A_vanishingly_small_MARR_gives_the_limits_at_zero(double rate)
    {
        // The arithmetic gradient's factor, 0/0 below about 1e-162 before, takes its limit n(n − 1)/2 (closed form at
        // i = 0, common practice, no source); the capitalized worth, which grows as 1/i, is beyond every double.
        var spec = new ModelSpec
        {
            Horizon = 1200,
            Rate = new RateSpec { Value = rate },
            Elements = [new ElementSpec { Type = ElementKind.Arithmetic, Label = "Ramp", Category = CashFlowCategory.Revenue, First = 1, Last = 1200, Amount = 0, Step = 1e11 }],
        };
        var e = Evaluator.Evaluate(spec).Value!;
        double expected = 1e11 * 1200.0 * 1199.0 / 2;
        Assert.Equal(expected, e.PresentWorth, expected * 1e-14);
        if (rate > 1e-290)
        {
            Assert.Null(e.CapitalizedWorth);
            Assert.Equal(UnavailableMeasures.BeyondRange, e.Unavailable[UnavailableMeasures.CapitalizedWorth]);
        }
    }

    [Fact]
    public void The_lower_bound_is_minus_40_percent_and_the_refusal_names_the_rate()
    {
        // The bound's own arithmetic (docs/methods.md): at −40% over 1,200 years the largest legal model's worth stays
        // below the largest double, 1.797 × 10^308 (IEEE 754); at −43% it would not.
        Assert.True(MarrBounds.LargestDiscountedSum < double.MaxValue);
        Assert.True(Math.Exp(-1200 * Math.Log(1 - 0.43)) * 500 * 1e15 * 1201 > double.MaxValue);
        ModelSpec At(double rate, RateBasis basis = RateBasis.Effective, int? m = null) => new()
        {
            Horizon = 1200,
            Rate = new RateSpec { Value = rate, Basis = basis, CompoundingsPerYear = m },
            Elements = [new ElementSpec { Type = ElementKind.Uniform, Label = "Saving", Category = CashFlowCategory.Revenue, First = 1, Last = 1200, Amount = 1e12 }],
        };
        Assert.True(Evaluator.Evaluate(At(-0.4)).IsValid);
        var refused = Evaluator.Evaluate(At(-0.4000001));
        Assert.Equal("rate.value", Assert.Single(refused.Errors).Field);
        Assert.Contains("−40%", refused.Errors[0].Message, StringComparison.Ordinal);
        // ln(0.6) = −0.5108 as a continuous rate is −40% effective; a nominal −52% monthly is about −41.4% effective.
        Assert.True(Evaluator.Evaluate(At(Math.Log(0.6) + 1e-12, RateBasis.Continuous)).IsValid);
        Assert.Equal("rate.value", Assert.Single(Evaluator.Evaluate(At(-0.52, RateBasis.Nominal, 12)).Errors).Field);
        // A real MARR meets inflation in its market rate, which the same bound holds: −30% real with −20% inflation is −44%.
        var real = Evaluator.Evaluate(At(-0.3) with { Inflation = new InflationSpec { Rate = -0.2, RealMarr = true } });
        Assert.Equal("inflation.rate", Assert.Single(real.Errors).Field);
    }

    /// <summary>Every double finite; every nullable measure a finite number, or null with a reason; no reason for a measure that has a value.</summary>
    internal static void AssertFiniteOrExplained(Engine.Evaluation.Evaluation e)
    {
        string where = string.Create(CultureInfo.InvariantCulture, $"MARR {e.Marr}, n {e.Model.Horizon}, p {e.Model.PeriodsPerYear}");
        foreach (var (name, value) in new (string, double)[]
        {
            ("presentWorth", e.PresentWorth), ("presentWorthOfNetFlows", e.PresentWorthOfNetFlows), ("annualWorth", e.AnnualWorth),
            ("periodWorth", e.PeriodWorth), ("marrPerPeriod", e.MarrPerPeriod),
        })
        {
            Assert.True(double.IsFinite(value), $"{name} is {value} at {where}");
        }
        Assert.All(e.NetFlows, f => Assert.True(double.IsFinite(f), $"a net flow is {f} at {where}"));
        Assert.All(e.RatesOfReturn, r => Assert.True(double.IsFinite(r), $"a rate of return is {r} at {where}"));
        foreach (var (name, value) in new (string, double?)[]
        {
            (UnavailableMeasures.FutureWorth, e.FutureWorth), (UnavailableMeasures.CapitalizedWorth, e.CapitalizedWorth),
            (UnavailableMeasures.ExternalRate, e.ExternalRate), (UnavailableMeasures.SimplePayback, e.SimplePayback),
            (UnavailableMeasures.DiscountedPayback, e.DiscountedPayback), (UnavailableMeasures.ConventionalRatio, e.BenefitCost.Conventional),
            (UnavailableMeasures.ModifiedRatio, e.BenefitCost.Modified),
        })
        {
            if (value is double v)
            {
                Assert.True(double.IsFinite(v), $"{name} is {v} at {where}");
                Assert.False(e.Unavailable.ContainsKey(name), $"{name} has a value and a reason at {where}");
            }
            else
            {
                Assert.True(e.Unavailable.TryGetValue(name, out string? reason) && reason.Length > 0, $"{name} is null without a reason at {where}");
            }
        }
        Assert.True(e.SimplePaybackYears is null || double.IsFinite(e.SimplePaybackYears.Value));
        Assert.True(e.DiscountedPaybackYears is null || double.IsFinite(e.DiscountedPaybackYears.Value));
    }
}
