using CapReview.Packets.Layout;
using CapReview.Packets.Signing;

namespace CapReview.Packets;

/// <summary>How packets are made (section "Packets"): the paper and the signing certificate.</summary>
public sealed class PacketOptions
{
    public PaperSize Paper { get; set; } = PaperSize.A4;

    public PacketSigningOptions Signing { get; set; } = new();
}
