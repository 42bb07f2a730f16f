using PdfSharp.Drawing;
using CapReview.Packets.Layout;
using PdfSharp.Pdf;
using PdfSharp.Pdf.Annotations;
using PdfSharp.Pdf.Signatures;

namespace CapReview.Packets.Signing;

/// <summary>
/// Signs a laid-out packet once (PKCS #7, SHA-256) and writes it out: the signature covers every byte but its own, so
/// any later change makes standard checkers (poppler's pdfsig, PDF readers) report it invalid.
/// </summary>
internal static class PacketSigner
{
    public static byte[] SignAndSave(PdfDocument document, PacketCertificate certificate, string organisation, string reason)
    {
        var options = new DigitalSignatureOptions
        {
            ContactInfo = organisation,
            Location = organisation,
            Reason = reason,
            AppName = "CapReview",
            // Measured from the bottom-left corner: a small field in the footer band of the first page.
            Rectangle = new XRect(document.Pages[0].Width.Point - 56 - 170, 18, 170, 22),
            PageIndex = 0,
            AppearanceHandler = new SignatureAppearance(certificate.Development ? "Signed: development certificate" : "Digitally signed by " + organisation),
        };
        DigitalSignatureHandler.ForDocument(document, new PdfSharpDefaultSigner(certificate.Certificate, PdfMessageDigestType.SHA256, null), options);
        using var stream = new MemoryStream();
        document.Save(stream, closeStream: false);
        return stream.ToArray();
    }
}

/// <summary>The visible signature field, in the packets' own font (the library's default asks for a system font).</summary>
internal sealed class SignatureAppearance(string text) : IAnnotationAppearanceHandler
{
    public void DrawAppearance(XGraphics gfx, XRect rect)
    {
        ArgumentNullException.ThrowIfNull(gfx);
        gfx.DrawRectangle(new XPen(PacketStyle.Rule, 0.75), rect);
        gfx.DrawString(text, PacketStyle.Small, PacketStyle.SoftBrush, rect, XStringFormats.Center);
    }
}
