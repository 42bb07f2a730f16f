using System.Globalization;
using CsCheck;

namespace CapReview.Web.Tests.Security;

/// <summary>
/// Generated valid input at the edges of what may be entered (docs/api.md, docs/methods.md "Limits of the input"):
/// MARRs at the −40% bound, exactly 0, vanishingly small either side of it, and at 1000% a year on every basis;
/// horizons of 1 and 1,200 periods of a day to a year; amounts of ±10^12 and as small as a double goes; growth near
/// −100% and at 1000%; constant money escalated at the limits; a tax block with a loan at times. As JSON text.
/// </summary>
public static class ExtremeJson
{
    private static string N(double value) => value.ToString("R", CultureInfo.InvariantCulture);

    private static readonly Gen<double> Rate = Gen.OneOf(
        Gen.Const(0.0), Gen.Const(-0.4), Gen.Const(10.0), Gen.Const(5e-324), Gen.Const(-5e-324), Gen.Double[-0.4, -0.3999],
        Gen.Int[1, 323].Select(k => Math.Pow(10, -k)), Gen.Int[1, 323].Select(k => -Math.Pow(10, -k)), Gen.Double[-0.4, 10.0]);

    private static readonly Gen<double> Amount = Gen.OneOf(Gen.Const(1e12), Gen.Const(-1e12), Gen.Const(5e-324), Gen.Const(-1e-300), Gen.Double[-1e12, 1e12]);

    private static readonly Gen<string> RateObject = Gen.Select(Rate, Gen.Int[0, 2], Gen.OneOf(Gen.Const(1), Gen.Const(8760), Gen.Int[1, 8760]),
        (value, basis, m) => basis switch
        {
            0 => $$"""{"value":{{N(value)}}}""",
            1 => $$"""{"value":{{N(value)}},"basis":"nominal","compoundingsPerYear":{{m}}}""",
            _ => $$"""{"value":{{N(value)}},"basis":"continuous"}""",
        });

    private static Gen<string> Element(int horizon)
    {
        var span = Gen.Select(Gen.Int[0, horizon], Gen.Int[0, horizon]).Select(p => (First: Math.Min(p.Item1, p.Item2), Last: Math.Max(p.Item1, p.Item2)));
        var category = Gen.OneOf(Gen.Const("capital"), Gen.Const("operating"), Gen.Const("revenue"), Gen.Const("salvage"), Gen.Const("tax"));
        var money = Gen.OneOf(Gen.Const(""), Gen.OneOf(Gen.Const(10.0), Gen.Const(-0.999999999), Gen.Double[-0.99, 10.0]).Select(e => ",\"money\":\"constant\",\"escalation\":" + N(e)));
        var growth = Gen.OneOf(Gen.Const(10.0), Gen.Const(-0.999999999), Gen.Double[-0.999, 10.0]);
        return Gen.OneOf(
            Gen.Select(category, Gen.Int[0, horizon], Amount, money, (c, t, a, m) => $$"""{"type":"single","label":"One","category":"{{c}}","period":{{t}},"amount":{{N(a)}}{{m}}}"""),
            Gen.Select(category, span, Amount, money, (c, s, a, m) => $$"""{"type":"uniform","label":"Level","category":"{{c}}","first":{{s.First}},"last":{{s.Last}},"amount":{{N(a)}}{{m}}}"""),
            Gen.Select(category, span, Amount, Amount, (c, s, a, g) => $$"""{"type":"arithmetic","label":"Ramp","category":"{{c}}","first":{{s.First}},"last":{{s.Last}},"amount":{{N(a)}},"step":{{N(g)}}}"""),
            Gen.Select(category, span, Amount, growth, (c, s, a, g) => $$"""{"type":"geometric","label":"Growing","category":"{{c}}","first":{{s.First}},"last":{{s.Last}},"amount":{{N(a)}},"growth":{{N(g)}}}"""),
            Gen.Select(category, span, Amount, Gen.Int[1, 1200], (c, s, a, k) => $$"""{"type":"recurring","label":"Every","category":"{{c}}","first":{{s.First}},"last":{{s.Last}},"every":{{k}},"amount":{{N(a)}}}"""));
    }

    private static readonly Gen<string> Inflation = Gen.OneOf(Gen.Const(""),
        Gen.Select(Gen.Double[-0.9, 10.0], Gen.Int[0, 100], Gen.Bool, (f, b, real) => ",\"inflation\":{\"rate\":" + N(f) + ",\"baseYear\":" + b + ",\"realMarr\":" + (real ? "true" : "false") + "}"));

    /// <summary>The model's own fields, without the surrounding braces; yearly periods when <paramref name="yearly"/>.</summary>
    private static Gen<string> ModelFields(bool yearly) =>
        Gen.Select(Gen.OneOf(Gen.Const(1), Gen.Const(2), Gen.Const(1200), Gen.Int[1, 1200]),
            yearly ? Gen.Const(1) : Gen.OneOf(Gen.Const(1), Gen.Const(12), Gen.Const(365), Gen.Int[1, 365]))
        .SelectMany(hp => Gen.Select(Element(hp.Item1).Array[1, 5], RateObject, Inflation,
            (elements, rate, inflation) => "\"periodsPerYear\":" + hp.Item2 + ",\"horizon\":" + hp.Item1 + ",\"rate\":" + rate
                + ",\"elements\":[" + string.Join(",", elements) + "]" + inflation));

    private static readonly Gen<string> Tax = Gen.Select(Gen.OneOf(Gen.Const(0.0), Gen.Const(0.99), Gen.Double[0, 0.99]), Gen.Int[1, 40], Gen.Bool, RateObject, Gen.Double[0, 1],
        (t, life, loan, afterTax, share) => "\"tax\":{\"incomeTaxRate\":" + N(t) + ",\"depreciation\":{\"method\":\"straightLine\",\"life\":" + life + "},\"afterTaxMarr\":" + afterTax
            + (loan ? ",\"loan\":{\"share\":" + N(share) + ",\"rate\":0.05,\"term\":" + life + "}" : "") + "}");

    /// <summary>A body for POST /api/v1/evaluations: a model, and at times (yearly models) its tax block.</summary>
    public static readonly Gen<string> Evaluation = Gen.Bool.SelectMany(taxed => taxed
        ? Gen.Select(ModelFields(yearly: true), Tax, (model, tax) => "{" + model + "," + tax + "}")
        : ModelFields(yearly: false).Select(model => "{" + model + "}"));

    /// <summary>A body for POST /api/v1/risk-analyses: an extreme model, a parameter varying the MARR, the life or an amount widely, few trials.</summary>
    public static readonly Gen<string> RiskAnalysis = Gen.Select(ModelFields(yearly: false),
        Gen.OneOf(
            Gen.Select(Gen.Double[-0.4, 0], Gen.Double[0, 10.0], (low, high) => $$"""{"name":"MARR","target":"rate","low":{{N(low)}},"mostLikely":{{N(low)}},"high":{{N(high)}}}"""),
            Gen.Select(Gen.Int[1, 1200], Gen.Int[1, 1200], (a, b) => $$"""{"name":"Life","target":"horizon","low":{{Math.Min(a, b)}},"mostLikely":{{Math.Min(a, b)}},"high":{{Math.Max(a, b)}},"distribution":"uniform"}"""),
            Gen.Select(Amount, Amount, (a, b) => $$"""{"name":"Amount","target":"elements[0].amount","low":{{N(Math.Min(a, b))}},"mostLikely":{{N(Math.Min(a, b))}},"high":{{N(Math.Max(a, b))}},"distribution":"pert"}""")),
        Gen.Int[1, 200], Gen.Int,
        (model, parameter, trials, seed) => "{\"model\":{" + model + "},\"risk\":{\"trials\":" + trials + ",\"seed\":" + seed + ",\"parameters\":[" + parameter + "]}}");
}
