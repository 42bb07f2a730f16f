using System.Reflection;
using PdfSharp.Fonts;

namespace CapReview.Packets.Fonts;

/// <summary>
/// The packets' typefaces, shipped in the repository and embedded in the assembly: DejaVu Sans (body), DejaVu Sans
/// Condensed (tables) and DejaVu Serif Bold (headings), under the Bitstream Vera licence with public-domain changes
/// (Fonts/LICENSE-DejaVu.txt). PDFsharp reads no system fonts; this resolver is registered once per process.
/// </summary>
public sealed class PacketFonts : IFontResolver
{
    public const string Sans = "CapReview Sans";
    public const string Condensed = "CapReview Condensed";
    public const string Serif = "CapReview Serif";

    private static readonly object Gate = new();

    /// <summary>Makes the packet fonts PDFsharp's font source; harmless to call again.</summary>
    public static void Register()
    {
        lock (Gate)
        {
            if (GlobalFontSettings.FontResolver is not PacketFonts)
            {
                GlobalFontSettings.FontResolver = new PacketFonts();
            }
        }
    }

    public FontResolverInfo? ResolveTypeface(string familyName, bool bold, bool italic) => familyName switch
    {
        Sans => new FontResolverInfo(bold ? "DejaVuSans-Bold" : "DejaVuSans"),
        Condensed => new FontResolverInfo(bold ? "DejaVuSansCondensed-Bold" : "DejaVuSansCondensed"),
        Serif => new FontResolverInfo("DejaVuSerif-Bold"),
        _ => null,
    };

    public byte[]? GetFont(string faceName)
    {
        using Stream? stream = Assembly.GetExecutingAssembly().GetManifestResourceStream($"CapReview.Packets.Fonts.{faceName}.ttf");
        if (stream is null)
        {
            return null;
        }
        using var copy = new MemoryStream();
        stream.CopyTo(copy);
        return copy.ToArray();
    }
}
