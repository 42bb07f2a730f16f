using System.Globalization;
using System.Security.Cryptography;

namespace CapReview.TestSupport;

/// <summary>
/// The tests' own authenticator app: time-based one-time codes as RFC 6238 defines them (HMAC-SHA1 over the count
/// of 30-second steps, dynamic truncation of RFC 4226), written from the RFCs and checked against RFC 6238's
/// Appendix B, independent of the library the app uses.
/// </summary>
public static class Rfc6238
{
    public static string Code(byte[] secret, DateTimeOffset at, int digits = 6)
    {
        long step = at.ToUnixTimeSeconds() / 30;
        byte[] counter = BitConverter.GetBytes(step);
        if (BitConverter.IsLittleEndian)
        {
            Array.Reverse(counter);
        }
#pragma warning disable CA5350 // RFC 6238 and every authenticator app use HMAC-SHA1; its weakness for signatures does not apply to HMAC here.
        byte[] hash = HMACSHA1.HashData(secret, counter);
#pragma warning restore CA5350
        int offset = hash[^1] & 0x0f;
        int binary = ((hash[offset] & 0x7f) << 24) | (hash[offset + 1] << 16) | (hash[offset + 2] << 8) | hash[offset + 3];
        return (binary % (int)Math.Pow(10, digits)).ToString(CultureInfo.InvariantCulture).PadLeft(digits, '0');
    }

    /// <summary>RFC 4648 base 32, as authenticator keys are written (spaces and case ignored).</summary>
    public static byte[] FromBase32(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        const string alphabet = "ABCDEFGHIJKLMNOPQRSTUVWXYZ234567";
        var bytes = new List<byte>();
        int buffer = 0, bits = 0;
        foreach (char c in text.ToUpperInvariant().Where(c => c is not (' ' or '=')))
        {
            buffer = (buffer << 5) | alphabet.IndexOf(c, StringComparison.Ordinal);
            bits += 5;
            if (bits >= 8)
            {
                bytes.Add((byte)(buffer >> (bits - 8)));
                bits -= 8;
            }
        }
        return [.. bytes];
    }
}
