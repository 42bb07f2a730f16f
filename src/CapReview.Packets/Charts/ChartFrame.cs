using CapReview.Packets.Layout;
using PdfSharp.Drawing;

namespace CapReview.Packets.Charts;

/// <summary>
/// The plot area of a vector chart: value-to-point mapping, grid lines with labels on the left and below, axis titles.
/// Everything is drawn as PDF paths and text, so it prints sharp and its labels are searchable.
/// </summary>
internal sealed class ChartFrame
{
    private const double LeftLabels = 62, BottomLabels = 30, TopSpace = 8, RightSpace = 10;

    public ChartFrame(XRect area, IReadOnlyList<double> xTicks, IReadOnlyList<double> yTicks)
    {
        Area = area;
        XTicks = xTicks;
        YTicks = yTicks;
        Plot = new XRect(area.X + LeftLabels, area.Y + TopSpace, area.Width - LeftLabels - RightSpace, area.Height - TopSpace - BottomLabels);
    }

    public XRect Area { get; }

    public XRect Plot { get; }

    public IReadOnlyList<double> XTicks { get; }

    public IReadOnlyList<double> YTicks { get; }

    public double X(double value) => Plot.Left + (value - XTicks[0]) / (XTicks[^1] - XTicks[0]) * Plot.Width;

    public double Y(double value) => Plot.Bottom - (value - YTicks[0]) / (YTicks[^1] - YTicks[0]) * Plot.Height;

    /// <summary>Grid, tick labels and titles; the x labels of <paramref name="xLabel"/> only where it returns text.</summary>
    public void DrawAxes(XGraphics g, Func<double, string?> xLabel, Func<double, string> yLabel, string xTitle, string yTitle)
    {
        var grid = new XPen(PacketStyle.Rule, 0.5);
        foreach (double y in YTicks)
        {
            g.DrawLine(y == 0 ? new XPen(PacketStyle.Ink, 1.0) : grid, Plot.Left, Y(y), Plot.Right, Y(y));
            g.DrawString(yLabel(y), PacketStyle.Small, PacketStyle.SoftBrush, new XRect(Area.Left, Y(y) - 5, LeftLabels - 6, 10), XStringFormats.CenterRight);
        }
        foreach (double x in XTicks)
        {
            if (xLabel(x) is string text)
            {
                g.DrawLine(grid, X(x), Plot.Top, X(x), Plot.Bottom);
                g.DrawString(text, PacketStyle.Small, PacketStyle.SoftBrush, new XRect(X(x) - 30, Plot.Bottom + 3, 60, 10), XStringFormats.TopCenter);
            }
        }
        g.DrawRectangle(new XPen(PacketStyle.Rule, 0.75), Plot);
        g.DrawString(xTitle, PacketStyle.Small, PacketStyle.InkBrush, new XRect(Plot.Left, Area.Bottom - 12, Plot.Width, 12), XStringFormats.TopCenter);
        XGraphicsState state = g.Save();
        g.RotateAtTransform(-90, new XPoint(Area.Left + 6, Plot.Top + Plot.Height / 2));
        g.DrawString(yTitle, PacketStyle.Small, PacketStyle.InkBrush, new XRect(Area.Left + 6 - Plot.Height / 2, Plot.Top + Plot.Height / 2 - 6, Plot.Height, 12), XStringFormats.TopCenter);
        g.Restore(state);
    }
}
