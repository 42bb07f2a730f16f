using CapReview.Engine.Risk;
using CapReview.Reviews.Risk;
using Plotly.Blazor;
using Plotly.Blazor.Traces;

namespace CapReview.Web.Components.Proposals;

/// <summary>The Plotly traces of the risk figures, drawn from the domain's results; nothing here computes a figure.</summary>
internal static class RiskCharts
{
    private static readonly string[] LineColours = ["#1d4e6b", "#b4532f", "#2f7a5d", "#e3b04b", "#55616b", "#7a4f9e"];

    /// <summary>Two overlaid bar sets about the most likely figure: the measure at each parameter's low and high value.</summary>
    public static IReadOnlyList<ITrace> Tornado(SensitivityResult result) =>
    [
        TornadoBars("At low", result, result.Tornado.Select(b => b.AtLow - result.Basis), "#b4532f"),
        TornadoBars("At high", result, result.Tornado.Select(b => b.AtHigh - result.Basis), "#2f7a5d"),
    ];

    public static IReadOnlyList<ITrace> Spider(SensitivityResult result) => [.. result.Spider.Select((line, k) => (ITrace)new Scatter
    {
        Name = line.Parameter.Name,
        Mode = Plotly.Blazor.Traces.ScatterLib.ModeFlag.Lines | Plotly.Blazor.Traces.ScatterLib.ModeFlag.Markers,
        X = line.Points.Select(p => (object)(p.Change * 100)).ToList(),
        Y = line.Points.Select(p => Point(p.Measure)).ToList(),
        Line = new Plotly.Blazor.Traces.ScatterLib.Line { Color = LineColours[k % LineColours.Length], Width = 2 },
        HoverTemplate = line.Parameter.Name + " %{x} %: %{y}<extra></extra>",
    })];

    /// <summary>The histogram of present worth; bins wholly below zero in red-brown.</summary>
    public static IReadOnlyList<ITrace> Histogram(SimulationSummary simulation) =>
    [
        new Bar
        {
            X = simulation.Histogram.Select(b => (object)((b.From + b.To) / 2)).ToList(),
            Y = simulation.Histogram.Select(b => (object)b.Count).ToList(),
            Marker = new Plotly.Blazor.Traces.BarLib.Marker { ColorArray = simulation.Histogram.Select(b => (object)(b.To <= 0 ? "#b4532f" : "#1d4e6b")).ToList() },
            HoverTemplate = "%{x}: %{y} trials<extra></extra>",
        },
    ];

    /// <summary>The cumulative distribution: present worth at each percent of the trials.</summary>
    public static IReadOnlyList<ITrace> Cumulative(SimulationSummary simulation) =>
    [
        new Scatter
        {
            Mode = Plotly.Blazor.Traces.ScatterLib.ModeFlag.Lines,
            X = simulation.Detail.Cumulative.Select(v => (object)v).ToList(),
            Y = Enumerable.Range(0, simulation.Detail.Cumulative.Count).Select(p => (object)p).ToList(),
            Line = new Plotly.Blazor.Traces.ScatterLib.Line { Color = "#1d4e6b", Width = 2.5m },
            HoverTemplate = "%{y} % of trials at or below %{x}<extra></extra>",
        },
    ];

    /// <summary>
    /// A figure as the chart's JSON can carry it: a move of an input that makes no valid model (a life past the
    /// horizon's limit) has no figure, and is a gap in the line or a missing bar, never a NaN the page cannot send.
    /// </summary>
    private static object? Point(double value) => double.IsFinite(value) ? value : null;

    public static string MeasureName(RiskMeasure measure) => measure == RiskMeasure.AnnualWorth ? "Annual worth" : "Present worth";

    private static Bar TornadoBars(string name, SensitivityResult result, IEnumerable<double> deltas, string color) => new()
    {
        Name = name,
        Orientation = Plotly.Blazor.Traces.BarLib.OrientationEnum.H,
        X = deltas.Select(Point).ToList(),
        Y = result.Tornado.Select(b => (object)b.Parameter.Name).ToList(),
        Base = result.Basis,
        Marker = new Plotly.Blazor.Traces.BarLib.Marker { Color = color },
        HoverTemplate = "%{y}: %{x}<extra></extra>",
    };
}
