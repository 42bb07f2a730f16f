using PdfSharp.Drawing;
using PdfSharp.Pdf;

namespace CapReview.Packets.Layout;

/// <summary>
/// Writes a document top to bottom: a cursor on the current page, a new page when the next block does not fit,
/// wrapped paragraphs measured with the real font, headings kept with what follows, bookmarks, and a last pass that
/// writes "page x of y" footers. PDFsharp gives the drawing; the flow is ours.
/// </summary>
internal sealed class PageFlow : IDisposable
{
    private const double Margin = 56;
    private const double FooterSpace = 28;
    private readonly double _margin = Margin;
    private XGraphics? _graphics;

    public PageFlow(PdfDocument document, PaperSize paper)
    {
        Document = document;
        Paper = paper;
        NewPage();
    }

    public PdfDocument Document { get; }

    public PaperSize Paper { get; }

    public PdfPage Page { get; private set; } = null!;

    public XGraphics Graphics => _graphics!;

    public double Y { get; set; }

    public double Left => _margin;

    public double Right => Page.Width.Point - _margin;

    public double Top => _margin;

    public double Bottom => Page.Height.Point - _margin - FooterSpace;

    public double Width => Right - Left;

    public double Remaining => Bottom - Y;

    public void NewPage()
    {
        _graphics?.Dispose();
        Page = Document.AddPage();
        Page.Size = Paper == PaperSize.Letter ? PdfSharp.PageSize.Letter : PdfSharp.PageSize.A4;
        _graphics = XGraphics.FromPdfPage(Page);
        Y = Top;
    }

    /// <summary>Starts a new page unless <paramref name="height"/> points still fit on this one.</summary>
    public void Ensure(double height)
    {
        if (Y + height > Bottom && Y > Top)
        {
            NewPage();
        }
    }

    public void Gap(double points) => Y = Math.Min(Y + points, Bottom);

    public static double LineHeight(XFont font) => font.Size * 1.32;

    /// <summary>A heading, kept on the page with at least <paramref name="keepWith"/> points of what follows.</summary>
    public void Heading(string text, XFont font, double keepWith = 60)
    {
        Ensure(LineHeight(font) + 6 + keepWith);
        Gap(Y > Top ? 8 : 0);
        Text(text, font, PacketStyle.BrandBrush);
        Gap(3);
    }

    /// <summary>A paragraph wrapped to the width (or <paramref name="width"/>), breaking to new pages line by line.</summary>
    public void Text(string text, XFont font, XBrush? brush = null, double indent = 0, double? width = null)
    {
        double available = (width ?? Width) - indent;
        foreach (string line in Wrap(text, font, available))
        {
            Ensure(LineHeight(font));
            Graphics.DrawString(line, font, brush ?? PacketStyle.InkBrush, new XRect(Left + indent, Y, available, LineHeight(font)), XStringFormats.TopLeft);
            Y += LineHeight(font);
        }
    }

    /// <summary>The lines of <paramref name="text"/> in <paramref name="font"/> no wider than <paramref name="width"/>.</summary>
    public IReadOnlyList<string> Wrap(string text, XFont font, double width)
    {
        var lines = new List<string>();
        foreach (string paragraph in text.Split('\n'))
        {
            string current = "";
            foreach (string word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                string candidate = current.Length == 0 ? word : current + " " + word;
                if (Graphics.MeasureString(candidate, font).Width <= width)
                {
                    current = candidate;
                    continue;
                }
                if (current.Length > 0)
                {
                    lines.Add(current);
                }
                current = word;
                // A word wider than the line (a hash, a long reference) is broken by characters.
                while (Graphics.MeasureString(current, font).Width > width && current.Length > 1)
                {
                    int fit = current.Length - 1;
                    while (fit > 1 && Graphics.MeasureString(current[..fit], font).Width > width)
                    {
                        fit--;
                    }
                    lines.Add(current[..fit]);
                    current = current[fit..];
                }
            }
            lines.Add(current);
        }
        return lines;
    }

    /// <summary>Label and value pairs in two columns, each value wrapped in its column; kept together where they fit.</summary>
    public void Pairs(IEnumerable<(string Label, string Value)> pairs, double labelWidth = 150)
    {
        var list = pairs.ToList();
        double valueWidth = Width - labelWidth;
        double total = list.Sum(p => LineHeight(PacketStyle.Body) * Wrap(p.Value, PacketStyle.Body, valueWidth).Count + 2);
        Ensure(Math.Min(total, Bottom - Top));
        foreach (var (label, value) in list)
        {
            var lines = Wrap(value, PacketStyle.Body, valueWidth);
            Ensure(LineHeight(PacketStyle.Body) * lines.Count);
            Graphics.DrawString(label, PacketStyle.BodyBold, PacketStyle.SoftBrush, new XRect(Left, Y, labelWidth - 8, LineHeight(PacketStyle.Body)), XStringFormats.TopLeft);
            foreach (string line in lines)
            {
                Graphics.DrawString(line, PacketStyle.Body, PacketStyle.InkBrush, new XRect(Left + labelWidth, Y, valueWidth, LineHeight(PacketStyle.Body)), XStringFormats.TopLeft);
                Y += LineHeight(PacketStyle.Body);
            }
            Y += 2;
        }
    }

    /// <summary>A boxed note (a caution, a warning) with a coloured bar at its left.</summary>
    public void Note(string title, string text, XColor bar)
    {
        double inner = Width - 18;
        var lines = Wrap(text, PacketStyle.Body, inner);
        double height = LineHeight(PacketStyle.BodyBold) + lines.Count * LineHeight(PacketStyle.Body) + 10;
        Ensure(height);
        Graphics.DrawRectangle(PacketStyle.TintBrush, Left, Y, Width, height);
        Graphics.DrawRectangle(new XSolidBrush(bar), Left, Y, 4, height);
        double y = Y + 5;
        Graphics.DrawString(title, PacketStyle.BodyBold, PacketStyle.InkBrush, new XRect(Left + 12, y, inner, LineHeight(PacketStyle.BodyBold)), XStringFormats.TopLeft);
        y += LineHeight(PacketStyle.BodyBold);
        foreach (string line in lines)
        {
            Graphics.DrawString(line, PacketStyle.Body, PacketStyle.InkBrush, new XRect(Left + 12, y, inner, LineHeight(PacketStyle.Body)), XStringFormats.TopLeft);
            y += LineHeight(PacketStyle.Body);
        }
        Y += height + 6;
    }

    /// <summary>A figure of the given height drawn by <paramref name="draw"/> into its rectangle, then its caption.</summary>
    public void Figure(double height, Action<XGraphics, XRect> draw, string caption)
    {
        ArgumentNullException.ThrowIfNull(draw);
        Ensure(height + 3 * LineHeight(PacketStyle.Small));
        draw(Graphics, new XRect(Left, Y, Width, height));
        Y += height + 4;
        Text(caption, PacketStyle.Small, PacketStyle.SoftBrush);
        Gap(6);
    }

    /// <summary>A thin rule across the text width.</summary>
    public void Rule(XColor? color = null)
    {
        Ensure(6);
        Graphics.DrawLine(new XPen(color ?? PacketStyle.Rule, 0.75), Left, Y + 2, Right, Y + 2);
        Y += 6;
    }

    /// <summary>A bookmark (outline entry) to the current page.</summary>
    public PdfOutline Bookmark(string title, PdfOutline? parent = null) =>
        (parent?.Outlines ?? Document.Outlines).Add(title, Page, true);

    /// <summary>Closes the last page and writes each page's footer: the left text and "page x of y".</summary>
    public void Finish(string footerLeft)
    {
        _graphics?.Dispose();
        _graphics = null;
        int count = Document.PageCount;
        for (int k = 0; k < count; k++)
        {
            PdfPage page = Document.Pages[k];
            using XGraphics g = XGraphics.FromPdfPage(page, XGraphicsPdfPageOptions.Append);
            double y = page.Height.Point - Margin + 6;
            double right = page.Width.Point - Margin;
            g.DrawLine(new XPen(PacketStyle.Rule, 0.75), Margin, y - 6, right, y - 6);
            g.DrawString(footerLeft, PacketStyle.Small, PacketStyle.SoftBrush, new XRect(Margin, y, right - Margin - 90, 12), XStringFormats.TopLeft);
            g.DrawString($"page {k + 1} of {count}", PacketStyle.Small, PacketStyle.SoftBrush, new XRect(right - 90, y, 90, 12), XStringFormats.TopRight);
        }
    }

    public void Dispose() => _graphics?.Dispose();
}
