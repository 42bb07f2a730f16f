using CapReview.Packets.Content;
using CapReview.Packets.Signing;

namespace CapReview.Packets;

/// <summary>Lays out, signs and writes a packet: the bytes to store and serve unchanged.</summary>
public static class PacketRenderer
{
    public static byte[] Proposal(ProposalPacketData data, PacketCertificate certificate)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(certificate);
        using var document = PacketComposer.Proposal(data with { Signing = certificate.Notice });
        return PacketSigner.SignAndSave(document, certificate, data.Organisation.Name, $"Approval record of {data.Proposal.Reference}, version {data.Decision.VersionNumber}");
    }

    public static byte[] Cycle(CyclePacketData data, PacketCertificate certificate)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(certificate);
        using var document = PacketComposer.Cycle(data with { Signing = certificate.Notice });
        return PacketSigner.SignAndSave(document, certificate, data.Organisation.Name, $"Decision record of {data.Cycle.Name}");
    }
}
