using System.IO.Compression;
using System.Security.Cryptography;
using System.Security.Cryptography.Pkcs;
using System.Security.Cryptography.X509Certificates;

namespace CapReview.Reviews.Interchange;

/// <summary>
/// A cycle document with proof of where it came from: the document and a detached CMS signature of its exact bytes
/// (SHA-256, the exporting installation's certificate included), packed as a ZIP of two entries, <c>name.json</c> and
/// <c>name.json.p7s</c>. The document's own hashes only say it is consistent; the signature says who made it and that
/// nobody changed it since, for whoever trusts that certificate.
/// </summary>
public static class SignedCycleDocument
{
    public const string SignatureSuffix = ".p7s";

    /// <summary>Whether the bytes are a ZIP (its local-file signature) rather than a bare JSON document.</summary>
    public static bool IsPacked(byte[] bytes) => bytes is [0x50, 0x4B, 0x03, 0x04, ..];

    /// <summary>The detached signature of <paramref name="document"/> with <paramref name="certificate"/> (which holds its private key).</summary>
    public static byte[] Sign(byte[] document, X509Certificate2 certificate)
    {
        var cms = new SignedCms(new ContentInfo(document), detached: true);
        cms.ComputeSignature(new CmsSigner(SubjectIdentifierType.IssuerAndSerialNumber, certificate)
        {
            DigestAlgorithm = new Oid("2.16.840.1.101.3.4.2.1"),
            IncludeOption = X509IncludeOption.EndCertOnly,
        });
        return cms.Encode();
    }

    public static byte[] Pack(string fileName, byte[] document, byte[] signature)
    {
        using var zip = new MemoryStream();
        using (var archive = new ZipArchive(zip, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var (name, bytes) in new[] { (fileName, document), (fileName + SignatureSuffix, signature) })
            {
                using Stream entry = archive.CreateEntry(name, CompressionLevel.Optimal).Open();
                entry.Write(bytes);
            }
        }
        return zip.ToArray();
    }

    /// <summary>The document and its signature out of the ZIP, or why they cannot be read; entries are read only up to <paramref name="maxBytes"/>.</summary>
    public static (byte[]? Document, byte[]? Signature, string? Error) Unpack(byte[] zip, long maxBytes)
    {
        try
        {
            using var archive = new ZipArchive(new MemoryStream(zip), ZipArchiveMode.Read);
            var entries = archive.Entries.Where(e => e.Length > 0).ToList();
            ZipArchiveEntry? document = entries.Count == 2 ? entries.SingleOrDefault(e => !e.Name.EndsWith(SignatureSuffix, StringComparison.OrdinalIgnoreCase)) : null;
            ZipArchiveEntry? signature = document is null ? null : entries.SingleOrDefault(e => e.Name == document.Name + SignatureSuffix);
            if (document is null || signature is null)
            {
                return (null, null, "A signed cycle document is a ZIP of two files: the document (name.json) and its signature (name.json.p7s).");
            }
            if (document.Length > maxBytes || signature.Length > 1024 * 1024)
            {
                return (null, null, $"The document is larger than {maxBytes / 1024 / 1024} MiB.");
            }
            return (Read(document), Read(signature), null);
        }
        catch (InvalidDataException)
        {
            return (null, null, "The file is not a readable ZIP.");
        }
    }

    /// <summary>
    /// Checks the signature over the document's exact bytes and that its signer is one of
    /// <paramref name="trustedSha256Thumbprints"/>; the description names the signer either way.
    /// </summary>
    public static (bool Valid, string Description) Verify(byte[] document, byte[] signature, IReadOnlyCollection<string> trustedSha256Thumbprints)
    {
        ArgumentNullException.ThrowIfNull(trustedSha256Thumbprints);
        var cms = new SignedCms(new ContentInfo(document), detached: true);
        try
        {
            cms.Decode(signature);
            // The signature only: whom to trust is this installation's list, not a public certificate chain.
            cms.CheckSignature(verifySignatureOnly: true);
        }
        catch (CryptographicException)
        {
            return (false, "The signature does not match the document: it was changed after it was signed, or the signature is damaged.");
        }
        X509Certificate2? signer = cms.SignerInfos.Count == 1 ? cms.SignerInfos[0].Certificate : null;
        if (signer is null)
        {
            return (false, "The signature names no single signer's certificate.");
        }
        string thumbprint = signer.GetCertHashString(HashAlgorithmName.SHA256);
        bool trusted = trustedSha256Thumbprints.Any(t => string.Equals(t.Replace(":", "", StringComparison.Ordinal), thumbprint, StringComparison.OrdinalIgnoreCase));
        return trusted
            ? (true, $"signed by {signer.Subject} (SHA-256 thumbprint {thumbprint}), verified")
            : (false, $"Signed by {signer.Subject} (SHA-256 thumbprint {thumbprint}), which this installation does not trust: add the thumbprint to Interchange:TrustedSigners to accept its documents.");
    }

    private static byte[] Read(ZipArchiveEntry entry)
    {
        using Stream stream = entry.Open();
        using var copy = new MemoryStream();
        stream.CopyTo(copy);
        return copy.ToArray();
    }
}

/// <summary>The certificates (by SHA-256 thumbprint) whose signed cycle documents this installation accepts as theirs.</summary>
public sealed record TrustedSigners(IReadOnlyList<string> Sha256Thumbprints)
{
    public static TrustedSigners None { get; } = new([]);
}
