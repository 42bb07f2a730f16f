using System.Security.Cryptography;
using CapReview.Reviews.Interchange;
using CapReview.Reviews.Organisation;

namespace CapReview.Packets.Signing;

/// <summary>Signs exported cycle documents with the certificate that signs the packets, so that another installation can check where one came from.</summary>
public sealed class CycleDocumentSigning(PacketCertificateSource certificates, OrganisationQueries organisation)
{
    /// <summary>The detached signature of the document's exact bytes.</summary>
    public async Task<byte[]> SignAsync(byte[] document, CancellationToken cancellationToken) =>
        SignedCycleDocument.Sign(document, (await CertificateAsync(cancellationToken).ConfigureAwait(false)).Certificate);

    /// <summary>The SHA-256 thumbprint another installation adds to its Interchange:TrustedSigners to accept this one's documents.</summary>
    public async Task<string> ThumbprintAsync(CancellationToken cancellationToken) =>
        (await CertificateAsync(cancellationToken).ConfigureAwait(false)).Certificate.GetCertHashString(HashAlgorithmName.SHA256);

    private async Task<PacketCertificate> CertificateAsync(CancellationToken cancellationToken)
    {
        OrganisationProfile profile = await organisation.GetAsync(cancellationToken).ConfigureAwait(false)
            ?? throw new InvalidOperationException("The organisation profile is missing.");
        return certificates.Get(profile.Name);
    }
}
