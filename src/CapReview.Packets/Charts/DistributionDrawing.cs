using CapReview.Engine.Risk;
using CapReview.Packets.Layout;
using PdfSharp.Drawing;

namespace CapReview.Packets.Charts;

/// <summary>The simulated distribution of present worth as vectors: the histogram, losing bins in red-brown.</summary>
internal static class DistributionDrawing
{
    public static void Draw(XGraphics g, XRect area, MonteCarloResult result, PacketFormat format)
    {
        var bins = result.Histogram;
        var frame = new ChartFrame(area, AxisScale.Ticks(bins[0].From, bins[^1].To), AxisScale.Ticks(0, bins.Max(b => b.Count)));
        frame.DrawAxes(g, format.Money, y => format.Number(y, 0), $"Present worth, {format.CurrencyCode}", "Trials");
        var gain = new XSolidBrush(PacketStyle.BrandSoft);
        var loss = new XSolidBrush(PacketStyle.Payment);
        foreach (HistogramBin b in bins)
        {
            double x0 = frame.X(b.From), x1 = frame.X(b.To), top = frame.Y(b.Count), zero = frame.Y(0);
            g.DrawRectangle(b.To <= 0 ? loss : gain, x0 + 0.3, top, Math.Max(0.1, x1 - x0 - 0.6), zero - top);
        }
    }
}
