namespace CapReview.Packets.Signing;

/// <summary>
/// The organisation's signing certificate (section "Packets:Signing"): a PFX file and its password from configuration
/// or the environment (Packets__Signing__CertificatePath, Packets__Signing__CertificatePassword), never committed.
/// Without one, a development certificate is made once at <see cref="DevelopmentCertificatePath"/> and every packet
/// says so.
/// </summary>
public sealed class PacketSigningOptions
{
    public string? CertificatePath { get; set; }

    public string? CertificatePassword { get; set; }

    /// <summary>Where the development certificate is kept; relative paths are resolved by the host.</summary>
    public string DevelopmentCertificatePath { get; set; } = "packet-signing-development.pfx";
}
