namespace CapReview.Web.Tests.Api;

/// <summary>One of the matrix's cycles: its id, its two proposals, and the first proposal's packet once the cycle is decided.</summary>
public sealed record MatrixCycle(int CycleId, int ProposalId, int OtherProposalId, int? PacketId)
{
    /// <summary>A packet id no packet has, for the states before any packet exists.</summary>
    public const int NoPacket = 999_999;

    /// <summary>The path with {cycle}, {proposal}, {other} and {packet} put in.</summary>
    public string Resolve(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        var culture = System.Globalization.CultureInfo.InvariantCulture;
        return path.Replace("{cycle}", CycleId.ToString(culture), StringComparison.Ordinal)
            .Replace("{proposal}", ProposalId.ToString(culture), StringComparison.Ordinal)
            .Replace("{other}", OtherProposalId.ToString(culture), StringComparison.Ordinal)
            .Replace("{packet}", (PacketId ?? NoPacket).ToString(culture), StringComparison.Ordinal);
    }
}
