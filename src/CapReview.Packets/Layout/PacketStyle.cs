using CapReview.Packets.Fonts;
using PdfSharp.Drawing;

namespace CapReview.Packets.Layout;

/// <summary>The packets' look: the app's ink-blue and amber on white paper, serif headings, condensed tables.</summary>
internal static class PacketStyle
{
    public static readonly XColor Brand = XColor.FromArgb(0x16, 0x32, 0x4a);
    public static readonly XColor BrandSoft = XColor.FromArgb(0x1d, 0x4e, 0x6b);
    public static readonly XColor Ink = XColor.FromArgb(0x1f, 0x2a, 0x33);
    public static readonly XColor InkSoft = XColor.FromArgb(0x55, 0x61, 0x6b);
    public static readonly XColor Rule = XColor.FromArgb(0xdd, 0xd6, 0xc6);
    public static readonly XColor Tint = XColor.FromArgb(0xf5, 0xf2, 0xea);
    public static readonly XColor Amber = XColor.FromArgb(0xe3, 0xb0, 0x4b);
    public static readonly XColor Receipt = XColor.FromArgb(0x2f, 0x7a, 0x5d);
    public static readonly XColor Payment = XColor.FromArgb(0xb4, 0x53, 0x2f);

    public static readonly XBrush InkBrush = new XSolidBrush(Ink);
    public static readonly XBrush SoftBrush = new XSolidBrush(InkSoft);
    public static readonly XBrush BrandBrush = new XSolidBrush(Brand);
    public static readonly XBrush TintBrush = new XSolidBrush(Tint);
    public static readonly XBrush WhiteBrush = new XSolidBrush(XColors.White);

    public static XFont Body { get; } = Font(PacketFonts.Sans, 9.5);
    public static XFont BodyBold { get; } = Font(PacketFonts.Sans, 9.5, bold: true);
    public static XFont Small { get; } = Font(PacketFonts.Sans, 8);
    public static XFont Table { get; } = Font(PacketFonts.Condensed, 8.5);
    public static XFont TableBold { get; } = Font(PacketFonts.Condensed, 8.5, bold: true);
    public static XFont Title { get; } = Font(PacketFonts.Serif, 22);
    public static XFont Heading1 { get; } = Font(PacketFonts.Serif, 14);
    public static XFont Heading2 { get; } = Font(PacketFonts.Serif, 11);
    public static XFont Figure { get; } = Font(PacketFonts.Sans, 14, bold: true);

    private static XFont Font(string family, double size, bool bold = false)
    {
        PacketFonts.Register();
        return new XFont(family, size, bold ? XFontStyleEx.Bold : XFontStyleEx.Regular);
    }
}
