namespace CapReview.Reviews.Records;

/// <summary>Whether a packet records one proposal's decision or a whole cycle's.</summary>
public enum PacketKind
{
    Proposal,
    Cycle,
}

/// <summary>
/// A signed approval packet as it was made at sign-off: its bytes, their SHA-256, what it records (the version and its
/// assumptions hash, the MARR policy version) and the certificate it was signed with. Written once and served unchanged.
/// </summary>
public sealed class ApprovalPacket
{
    public int Id { get; set; }

    public PacketKind Kind { get; set; }

    public int BudgetCycleId { get; set; }

    /// <summary>The proposal of a proposal packet; null for a cycle packet.</summary>
    public int? ProposalId { get; set; }

    public int? VersionNumber { get; set; }

    public string? AssumptionsHash { get; set; }

    public int MarrPolicyVersionId { get; set; }

    public required string FileName { get; set; }

    /// <summary>Lower-case hex SHA-256 of <see cref="Content"/>.</summary>
    public required string FileSha256 { get; set; }

    public required byte[] Content { get; set; }

    public DateTimeOffset CreatedAt { get; set; }

    public required string CertificateSubject { get; set; }

    public required string CertificateThumbprint { get; set; }

    public bool DevelopmentCertificate { get; set; }
}

/// <summary>A stored packet without its bytes, for listings.</summary>
public sealed record PacketSummary(int Id, PacketKind Kind, int BudgetCycleId, int? ProposalId, int? VersionNumber, string FileName, string FileSha256,
    long Length, DateTimeOffset CreatedAt, bool DevelopmentCertificate);
