using CapReview.Engine.Measures;
using CapReview.Packets.Layout;
using PdfSharp.Drawing;

namespace CapReview.Packets.Charts;

/// <summary>The present worth profile as vectors: PW against the annual rate, the MARR dashed, each rate of return marked.</summary>
internal static class WorthProfileDrawing
{
    public static void Draw(XGraphics g, XRect area, IReadOnlyList<ProfilePoint> profile, IReadOnlyList<double> roots, double marr, PacketFormat format)
    {
        var xTicks = AxisScale.Ticks(profile[0].AnnualRate * 100, profile[^1].AnnualRate * 100, 8);
        var frame = new ChartFrame(area, xTicks, AxisScale.Ticks(Math.Min(0, profile.Min(p => p.PresentWorth)), Math.Max(0, profile.Max(p => p.PresentWorth))));
        frame.DrawAxes(g, x => format.Number(x, 0) + " %", format.Money, "Annual rate", $"Present worth, {format.CurrencyCode}");
        var points = profile.Select(p => new XPoint(frame.X(p.AnnualRate * 100), frame.Y(p.PresentWorth))).ToArray();
        g.DrawLines(new XPen(PacketStyle.BrandSoft, 1.8), points);
        if (marr * 100 >= xTicks[0] && marr * 100 <= xTicks[^1])
        {
            var dashed = new XPen(PacketStyle.Amber, 1.2) { DashStyle = XDashStyle.Dash };
            g.DrawLine(dashed, frame.X(marr * 100), frame.Plot.Top, frame.X(marr * 100), frame.Plot.Bottom);
            g.DrawString("MARR " + format.Percent(marr), PacketStyle.Small, PacketStyle.InkBrush, frame.X(marr * 100) + 3, frame.Plot.Top + 9);
        }
        var mark = new XSolidBrush(PacketStyle.Payment);
        foreach (double root in roots.Where(r => r * 100 >= xTicks[0] && r * 100 <= xTicks[^1]))
        {
            double x = frame.X(root * 100), y = frame.Y(0);
            g.DrawPolygon(mark, [new XPoint(x, y - 5), new XPoint(x + 5, y), new XPoint(x, y + 5), new XPoint(x - 5, y)], XFillMode.Winding);
            g.DrawString(format.Percent(root), PacketStyle.Small, PacketStyle.InkBrush, x + 6, y - 6);
        }
    }
}
