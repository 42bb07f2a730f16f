using CapReview.Engine.Risk;
using CapReview.Packets.Layout;
using PdfSharp.Drawing;

namespace CapReview.Packets.Charts;

/// <summary>The tornado as vectors: for each parameter, a bar from its low-value worth to its high-value worth about the most likely worth.</summary>
internal static class TornadoDrawing
{
    public static void Draw(XGraphics g, XRect area, IReadOnlyList<TornadoBar> bars, double basis, PacketFormat format)
    {
        double low = Math.Min(basis, bars.Min(b => Math.Min(b.AtLow, b.AtHigh)));
        double high = Math.Max(basis, bars.Max(b => Math.Max(b.AtLow, b.AtHigh)));
        var ticks = AxisScale.Ticks(low, high);
        const double labels = 120;
        var plot = new XRect(area.X + labels, area.Y + 4, area.Width - labels - 10, area.Height - 34);
        double X(double v) => plot.Left + (v - ticks[0]) / (ticks[^1] - ticks[0]) * plot.Width;
        var grid = new XPen(PacketStyle.Rule, 0.5);
        foreach (double t in ticks)
        {
            g.DrawLine(grid, X(t), plot.Top, X(t), plot.Bottom);
            g.DrawString(format.Money(t), PacketStyle.Small, PacketStyle.SoftBrush, new XRect(X(t) - 30, plot.Bottom + 3, 60, 10), XStringFormats.TopCenter);
        }
        g.DrawString($"Present worth, {format.CurrencyCode}", PacketStyle.Small, PacketStyle.InkBrush, new XRect(plot.Left, area.Bottom - 12, plot.Width, 12), XStringFormats.TopCenter);
        double row = plot.Height / bars.Count;
        var lowBrush = new XSolidBrush(PacketStyle.Payment);
        var highBrush = new XSolidBrush(PacketStyle.Receipt);
        for (int k = 0; k < bars.Count; k++)
        {
            double y = plot.Top + k * row + row * 0.2, h = row * 0.6;
            TornadoBar b = bars[k];
            g.DrawString(b.Parameter.Name, PacketStyle.Small, PacketStyle.InkBrush, new XRect(area.X, y, labels - 6, h), XStringFormats.CenterRight);
            g.DrawRectangle(lowBrush, Math.Min(X(b.AtLow), X(basis)), y, Math.Abs(X(b.AtLow) - X(basis)), h);
            g.DrawRectangle(highBrush, Math.Min(X(b.AtHigh), X(basis)), y, Math.Abs(X(b.AtHigh) - X(basis)), h);
        }
        g.DrawLine(new XPen(PacketStyle.Ink, 1), X(basis), plot.Top, X(basis), plot.Bottom);
    }
}
