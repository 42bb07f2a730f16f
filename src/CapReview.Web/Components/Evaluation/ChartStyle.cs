using Plotly.Blazor;
using Plotly.Blazor.LayoutLib;

namespace CapReview.Web.Components.Evaluation;

/// <summary>CapReview's chart look: quiet grid, the page's typeface, no toolbar.</summary>
internal static class ChartStyle
{
    public static Config Config() => new()
    {
        Responsive = true,
        DisplayModeBar = Plotly.Blazor.ConfigLib.DisplayModeBarEnum.False,
    };

    public static void SetTitles(Plotly.Blazor.Layout layout, string xTitle, string yTitle)
    {
        layout.XAxis[0].Title.Text = xTitle;
        layout.YAxis[0].Title.Text = yTitle;
    }

    /// <summary>
    /// Hover labels write their numbers through the axis's hover format rather than a format in the template: Plotly
    /// then writes a negative number with the minus sign (U+2212) its axes and the app's tables use, where a template's
    /// own format writes a hyphen.
    /// </summary>
    public static Plotly.Blazor.Layout Layout(string xTitle, string yTitle) => new()
    {
        Height = 300,
        Margin = new Margin { L = 56, R = 16, T = 12, B = 48 },
        PaperBgColor = "rgba(0,0,0,0)",
        PlotBgColor = "rgba(0,0,0,0)",
        Font = new Font { Family = "Source Sans 3, Segoe UI, Noto Sans, DejaVu Sans, sans-serif", Size = 13, Color = "#27313b" },
        ShowLegend = false,
        XAxis = [new XAxis { Title = new Plotly.Blazor.LayoutLib.XAxisLib.Title { Text = xTitle }, GridColor = "#e4dfd3", ZeroLineColor = "#9aa3ab", HoverFormat = ",.0f", AutoMargin = Plotly.Blazor.LayoutLib.XAxisLib.AutoMarginFlag.True }],
        YAxis = [new YAxis { Title = new Plotly.Blazor.LayoutLib.YAxisLib.Title { Text = yTitle }, GridColor = "#e4dfd3", ZeroLineColor = "#27313b", ZeroLineWidth = 1.5m, TickFormat = ",.0f", HoverFormat = ",.0f", AutoMargin = Plotly.Blazor.LayoutLib.YAxisLib.AutoMarginFlag.True }],
    };
}
