using System.IO.Compression;
using System.Text;

namespace CapReview.Web.Components;

/// <summary>
/// Text a prerendered page carries to its live page, compressed. The browser sends persisted state back when the
/// circuit starts, in one SignalR message under the hub's size limit (<see cref="MaxMessageBytes"/>); a document too
/// large to carry is not carried, and the live page reads it again instead of never going live.
/// </summary>
public static class PersistedText
{
    /// <summary>The largest message a circuit's browser may send (the persisted state travels in one).</summary>
    public const long MaxMessageBytes = 1024 * 1024;

    /// <summary>
    /// The largest packed text carried: the state is encoded twice more on its way (as bytes in base64, then protected
    /// and in base64 again), about 1.8 times this, which leaves room under <see cref="MaxMessageBytes"/>.
    /// </summary>
    public const int MaxPackedChars = 400_000;

    /// <summary>The text gzipped in base64, or null when even that is too large to carry.</summary>
    public static string? Pack(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        using var packed = new MemoryStream();
        using (var gzip = new GZipStream(packed, CompressionLevel.Fastest, leaveOpen: true))
        {
            gzip.Write(Encoding.UTF8.GetBytes(text));
        }
        string carried = Convert.ToBase64String(packed.GetBuffer(), 0, (int)packed.Length);
        return carried.Length <= MaxPackedChars ? carried : null;
    }

    public static string Unpack(string packed)
    {
        using var gzip = new GZipStream(new MemoryStream(Convert.FromBase64String(packed)), CompressionMode.Decompress);
        using var reader = new StreamReader(gzip, Encoding.UTF8);
        return reader.ReadToEnd();
    }
}
