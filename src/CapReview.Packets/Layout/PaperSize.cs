namespace CapReview.Packets.Layout;

/// <summary>The paper a packet is laid out on.</summary>
public enum PaperSize
{
    /// <summary>ISO A4, 210 × 297 mm.</summary>
    A4,

    /// <summary>US Letter, 8.5 × 11 in.</summary>
    Letter,
}
