using System.Security.Cryptography.Pkcs;
using System.Text;
using System.Text.RegularExpressions;

namespace CapReview.Packets.Tests;

/// <summary>In-process check of a packet's signature: the signed byte ranges against the detached PKCS #7 it carries.</summary>
internal static partial class SignatureCheck
{
    public static (int Start, int GapStart, int GapEnd) Ranges(byte[] pdf)
    {
        string text = Encoding.Latin1.GetString(pdf);
        Match range = ByteRange().Match(text);
        int a = int.Parse(range.Groups[1].Value), b = int.Parse(range.Groups[2].Value), c = int.Parse(range.Groups[3].Value);
        return (a, a + b, c);
    }

    public static bool Verifies(byte[] pdf)
    {
        string text = Encoding.Latin1.GetString(pdf);
        Match range = ByteRange().Match(text);
        int a = int.Parse(range.Groups[1].Value), b = int.Parse(range.Groups[2].Value), c = int.Parse(range.Groups[3].Value), d = int.Parse(range.Groups[4].Value);
        byte[] signed = [.. pdf.AsSpan(a, b), .. pdf.AsSpan(c, d)];
        string hex = text[(a + b)..c].Trim('<', '>', ' ');
        byte[] contents = Convert.FromHexString(hex.TrimEnd('0').Length % 2 == 0 ? hex.TrimEnd('0') : hex.TrimEnd('0') + "0");
        try
        {
            var cms = new SignedCms(new ContentInfo(signed), detached: true);
            cms.Decode(contents);
            cms.CheckSignature(verifySignatureOnly: true);
            return true;
        }
        catch (System.Security.Cryptography.CryptographicException)
        {
            return false;
        }
    }

    [GeneratedRegex(@"/ByteRange\s*\[\s*(\d+)\s+(\d+)\s+(\d+)\s+(\d+)\s*\]")]
    private static partial Regex ByteRange();
}
