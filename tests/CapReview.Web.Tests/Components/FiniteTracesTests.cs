using CapReview.Web.Components.Charts;
using Plotly.Blazor.Traces;

namespace CapReview.Web.Tests.Components;

/// <summary>The chart library's JSON cannot carry NaN or infinity: the one guard turns each into a gap, finite values untouched.</summary>
public sealed class FiniteTracesTests
{
    [Fact]
    public void Every_non_finite_number_of_a_trace_becomes_a_gap()
    {
        var bar = new Bar
        {
            X = [1.5, double.NaN, double.PositiveInfinity, 4.0],
            Y = ["a", "b", "c", "d"],
            Base = double.NegativeInfinity,
        };

        FiniteTraces.Of(bar);

        Assert.Equal([1.5, null, null, 4.0], bar.X);
        Assert.Equal(["a", "b", "c", "d"], bar.Y);
        Assert.Null(bar.Base);
    }

    [Fact]
    public void A_chart_of_an_infinite_figure_is_written_as_json_without_failing()
    {
        var line = new Scatter { X = [0.0, 1.0], Y = [double.PositiveInfinity, 2.0] };

        string json = System.Text.Json.JsonSerializer.Serialize<object>(FiniteTraces.Of(line));

        Assert.Contains("[null,2]", json, StringComparison.Ordinal);
    }
}
