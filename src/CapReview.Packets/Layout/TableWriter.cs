using PdfSharp.Drawing;

namespace CapReview.Packets.Layout;

/// <summary>A column of a packet table: its header, its share of the width and how its cells align.</summary>
internal sealed record TableColumn(string Header, double Weight, bool AlignRight = false);

/// <summary>One row: its cells and whether it is set in bold (totals).</summary>
internal sealed record TableRow(IReadOnlyList<string> Cells, bool Bold = false);

/// <summary>
/// Draws a table that may run over several pages: cells wrapped within their columns, the header repeated at the top
/// of every page the table continues on, a light band on every other row, numbers right-aligned.
/// </summary>
internal static class TableWriter
{
    private const double Padding = 3;

    public static void Draw(PageFlow flow, IReadOnlyList<TableColumn> columns, IEnumerable<TableRow> rows)
    {
        double total = columns.Sum(c => c.Weight);
        double[] widths = [.. columns.Select(c => flow.Width * c.Weight / total)];
        double headerHeight = RowHeight(flow, [.. columns.Select(c => c.Header)], widths, PacketStyle.TableBold);
        flow.Ensure(headerHeight + 3 * PageFlow.LineHeight(PacketStyle.Table));
        Header(flow, columns, widths, headerHeight);
        int index = 0;
        foreach (TableRow row in rows)
        {
            XFont font = row.Bold ? PacketStyle.TableBold : PacketStyle.Table;
            double height = RowHeight(flow, row.Cells, widths, font);
            if (flow.Y + height > flow.Bottom)
            {
                flow.NewPage();
                Header(flow, columns, widths, headerHeight);
            }
            if (index++ % 2 == 1)
            {
                flow.Graphics.DrawRectangle(PacketStyle.TintBrush, flow.Left, flow.Y, flow.Width, height);
            }
            Cells(flow, columns, widths, row.Cells, font, PacketStyle.InkBrush);
            if (row.Bold)
            {
                flow.Graphics.DrawLine(new XPen(PacketStyle.Ink, 0.9), flow.Left, flow.Y, flow.Right, flow.Y);
            }
            flow.Y += height;
        }
        flow.Graphics.DrawLine(new XPen(PacketStyle.Rule, 0.75), flow.Left, flow.Y, flow.Right, flow.Y);
        flow.Gap(6);
    }

    private static void Header(PageFlow flow, IReadOnlyList<TableColumn> columns, double[] widths, double height)
    {
        flow.Graphics.DrawRectangle(PacketStyle.BrandBrush, flow.Left, flow.Y, flow.Width, height);
        Cells(flow, columns, widths, [.. columns.Select(c => c.Header)], PacketStyle.TableBold, PacketStyle.WhiteBrush);
        flow.Y += height;
    }

    private static void Cells(PageFlow flow, IReadOnlyList<TableColumn> columns, double[] widths, IReadOnlyList<string> cells, XFont font, XBrush brush)
    {
        double x = flow.Left;
        for (int k = 0; k < columns.Count; k++)
        {
            double lineY = flow.Y + Padding;
            foreach (string line in flow.Wrap(cells[k], font, widths[k] - 2 * Padding))
            {
                var box = new XRect(x + Padding, lineY, widths[k] - 2 * Padding, PageFlow.LineHeight(font));
                flow.Graphics.DrawString(line, font, brush, box, columns[k].AlignRight ? XStringFormats.TopRight : XStringFormats.TopLeft);
                lineY += PageFlow.LineHeight(font);
            }
            x += widths[k];
        }
    }

    private static double RowHeight(PageFlow flow, IReadOnlyList<string> cells, double[] widths, XFont font) =>
        2 * Padding + PageFlow.LineHeight(font) * cells.Select((c, k) => flow.Wrap(c, font, widths[k] - 2 * Padding).Count).Max();
}
