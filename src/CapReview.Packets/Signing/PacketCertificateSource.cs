namespace CapReview.Packets.Signing;

/// <summary>Loads the signing certificate once per process (making the development one on first use when none is configured).</summary>
public sealed class PacketCertificateSource(PacketOptions options) : IDisposable
{
    private readonly Lock _gate = new();
    private PacketCertificate? _certificate;

    public PacketCertificate Get(string organisationName)
    {
        lock (_gate)
        {
            return _certificate ??= PacketCertificate.Load(options.Signing, organisationName);
        }
    }

    public void Dispose() => _certificate?.Dispose();
}
