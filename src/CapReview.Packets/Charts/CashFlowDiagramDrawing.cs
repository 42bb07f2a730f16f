using CapReview.Packets.Layout;
using PdfSharp.Drawing;

namespace CapReview.Packets.Charts;

/// <summary>The cash-flow diagram as vectors: a bar per period, receipts up in green, payments down in red-brown.</summary>
internal static class CashFlowDiagramDrawing
{
    public static void Draw(XGraphics g, XRect area, IReadOnlyList<double> netFlows, int periodsPerYear, PacketFormat format)
    {
        int n = netFlows.Count - 1;
        double low = Math.Min(0, netFlows.Min()), high = Math.Max(0, netFlows.Max());
        var frame = new ChartFrame(area, [-0.5, n + 0.5], AxisScale.Ticks(low, high));
        int every = Math.Max(1, (int)Math.Ceiling((n + 1) / 14.0));
        var xTicks = Enumerable.Range(0, n + 1).Where(t => t % every == 0).Select(t => (double)t).ToList();
        var labelled = new ChartFrame(area, [-0.5, .. xTicks, n + 0.5], frame.YTicks);
        labelled.DrawAxes(g, x => x >= 0 && x <= n && x == Math.Floor(x) ? ((int)x).ToString(format.Culture) : null,
            format.Money, periodsPerYear == 1 ? "Year" : $"Period ({periodsPerYear} a year)", $"Net cash flow, {format.CurrencyCode}");
        double step = labelled.X(1) - labelled.X(0);
        double width = Math.Min(14, step * 0.6);
        var receipt = new XSolidBrush(PacketStyle.Receipt);
        var payment = new XSolidBrush(PacketStyle.Payment);
        for (int t = 0; t <= n; t++)
        {
            double value = netFlows[t];
            if (value == 0)
            {
                continue;
            }
            double x = labelled.X(t), zero = labelled.Y(0), tip = labelled.Y(value);
            g.DrawRectangle(value > 0 ? receipt : payment, x - width / 2, Math.Min(zero, tip), width, Math.Abs(zero - tip));
        }
    }
}
