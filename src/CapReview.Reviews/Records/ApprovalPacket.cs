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
    private ApprovalPacket()
    {
    }

    public int Id { get; private set; }

    public PacketKind Kind { get; private set; }

    public int BudgetCycleId { get; private set; }

    /// <summary>The proposal of a proposal packet; null for a cycle packet.</summary>
    public int? ProposalId { get; private set; }

    public int? VersionNumber { get; private set; }

    public string? AssumptionsHash { get; private set; }

    public int MarrPolicyVersionId { get; private set; }

    public string FileName { get; private set; } = "";

    /// <summary>Lower-case hex SHA-256 of <see cref="Content"/>, taken when the packet is made.</summary>
    public string FileSha256 { get; private set; } = "";

    public byte[] Content { get; private set; } = [];

    public DateTimeOffset CreatedAt { get; private set; }

    public string CertificateSubject { get; private set; } = "";

    public string CertificateThumbprint { get; private set; } = "";

    public bool DevelopmentCertificate { get; private set; }

    /// <summary>How many events the audit chain held when the packet was signed; the packet states it too.</summary>
    public long? AuditEventCount { get; private set; }

    /// <summary>The audit chain's last hash when the packet was signed; the packet states it too.</summary>
    public string? AuditHeadHash { get; private set; }

    /// <summary>
    /// A packet as made and signed: what it records, its bytes and their SHA-256 (taken here, so a stored hash always
    /// belongs to the stored bytes), the certificate it was signed with and the audit chain's head it states.
    /// </summary>
    public static ApprovalPacket Made(PacketRecord record, string fileName, byte[] content, DateTimeOffset createdAt, SigningCertificate signer,
        Audit.AuditHead? auditHead = null)
    {
        ArgumentNullException.ThrowIfNull(record);
        ArgumentNullException.ThrowIfNull(content);
        ArgumentNullException.ThrowIfNull(signer);
        ArgumentException.ThrowIfNullOrWhiteSpace(fileName);
        if (record.Kind == PacketKind.Proposal != record.ProposalId is not null)
        {
            throw new ArgumentException("A proposal packet names its proposal; a cycle packet names none.", nameof(record));
        }
        return new ApprovalPacket
        {
            Kind = record.Kind,
            BudgetCycleId = record.CycleId,
            ProposalId = record.ProposalId,
            VersionNumber = record.VersionNumber,
            AssumptionsHash = record.AssumptionsHash,
            MarrPolicyVersionId = record.MarrPolicyVersionId,
            FileName = fileName,
            Content = content,
            FileSha256 = PacketArchive.Sha256(content),
            CreatedAt = createdAt,
            CertificateSubject = signer.Subject,
            CertificateThumbprint = signer.Thumbprint,
            DevelopmentCertificate = signer.Development,
            AuditEventCount = auditHead?.Count,
            AuditHeadHash = auditHead?.Hash,
        };
    }
}

/// <summary>What a packet records: its kind, the cycle, the proposal and version decided (none for a cycle packet), the MARR policy version.</summary>
public sealed record PacketRecord(PacketKind Kind, int CycleId, int? ProposalId, int? VersionNumber, string? AssumptionsHash, int MarrPolicyVersionId);

/// <summary>The certificate a packet was signed with, as the record keeps it.</summary>
public sealed record SigningCertificate(string Subject, string Thumbprint, bool Development);

/// <summary>A stored packet without its bytes, for listings.</summary>
public sealed record PacketSummary(int Id, PacketKind Kind, int BudgetCycleId, int? ProposalId, int? VersionNumber, string FileName, string FileSha256,
    long Length, DateTimeOffset CreatedAt, bool DevelopmentCertificate);
