using System.Security.Cryptography;
using System.Security.Cryptography.X509Certificates;
using CapReview.Packets.Content;

namespace CapReview.Packets.Signing;

/// <summary>The certificate packets are signed with: the organisation's, or a development one this installation made.</summary>
public sealed class PacketCertificate : IDisposable
{
    private PacketCertificate(X509Certificate2 certificate, bool development)
    {
        Certificate = certificate;
        Development = development;
    }

    public X509Certificate2 Certificate { get; }

    public bool Development { get; }

    public SigningNotice Notice => new(Certificate.Subject, Certificate.Thumbprint, Development);

    /// <summary>The configured certificate, or the development certificate (made on first use).</summary>
    public static PacketCertificate Load(PacketSigningOptions options, string organisationName)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (!string.IsNullOrWhiteSpace(options.CertificatePath))
        {
            if (!File.Exists(options.CertificatePath))
            {
                throw new InvalidOperationException($"Packets:Signing:CertificatePath names {options.CertificatePath}, which does not exist.");
            }
            var configured = X509CertificateLoader.LoadPkcs12FromFile(options.CertificatePath, options.CertificatePassword, X509KeyStorageFlags.EphemeralKeySet);
            if (!configured.HasPrivateKey)
            {
                configured.Dispose();
                throw new InvalidOperationException("The packet-signing certificate has no private key: give the PFX that holds it.");
            }
            return new PacketCertificate(configured, development: false);
        }
        string path = options.DevelopmentCertificatePath;
        if (!File.Exists(path))
        {
            CreateDevelopmentCertificate(path, organisationName);
        }
        return new PacketCertificate(X509CertificateLoader.LoadPkcs12FromFile(path, null, X509KeyStorageFlags.EphemeralKeySet), development: true);
    }

    private static void CreateDevelopmentCertificate(string path, string organisationName)
    {
        using var key = RSA.Create(3072);
        string organisation = organisationName.Replace(",", " ", StringComparison.Ordinal).Replace("=", " ", StringComparison.Ordinal);
        var request = new CertificateRequest($"CN=CapReview development signing (not for audit), O={organisation}", key, HashAlgorithmName.SHA256, RSASignaturePadding.Pkcs1);
        request.CertificateExtensions.Add(new X509KeyUsageExtension(X509KeyUsageFlags.DigitalSignature | X509KeyUsageFlags.NonRepudiation, critical: true));
        request.CertificateExtensions.Add(new X509BasicConstraintsExtension(false, false, 0, critical: true));
        using X509Certificate2 certificate = request.CreateSelfSigned(DateTimeOffset.UtcNow.AddMinutes(-5), DateTimeOffset.UtcNow.AddYears(5));
        string? folder = Path.GetDirectoryName(Path.GetFullPath(path));
        if (folder is not null)
        {
            Directory.CreateDirectory(folder);
        }
        // Written to a temporary name first, so a half-written file is never taken for the certificate.
        string temporary = path + ".tmp";
        File.WriteAllBytes(temporary, certificate.Export(X509ContentType.Pfx));
        if (!OperatingSystem.IsWindows())
        {
            File.SetUnixFileMode(temporary, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        }
        File.Move(temporary, path, overwrite: false);
    }

    public void Dispose() => Certificate.Dispose();
}
