namespace CapReview.Reviews.Proposals;

/// <summary>A proposal as the services hand it out: a detached snapshot, never a tracked entity.</summary>
public sealed record ProposalView(
    int Id,
    string Reference,
    string OwnerId,
    string Title,
    string Description,
    ProposalCategory Category,
    RiskClass RiskClass,
    ProposalStatus Status,
    int? BudgetCycleId,
    int Revision,
    IReadOnlyList<VersionView> Versions)
{
    [System.Text.Json.Serialization.JsonIgnore]
    public VersionView Latest => Versions[^1];

    /// <summary>The version the board reviews and decides: the last one submitted (frozen), if any.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public VersionView? UnderReview => Versions.LastOrDefault(v => v.IsFrozen);

    /// <summary>The lead's revision waiting beside the version under review (<see cref="Proposal.PendingRevision"/>), if any.</summary>
    [System.Text.Json.Serialization.JsonIgnore]
    public VersionView? PendingRevision => ProposalWorkflow.IsBeforeTheBoard(Status) && !Latest.IsFrozen ? Latest : null;

    /// <summary>The version with this number; a missing one is not found, like a proposal the caller may not see.</summary>
    public VersionView Version(int number) =>
        Versions.FirstOrDefault(v => v.Number == number) ?? throw new Common.NotFoundException($"{Reference} has no version {number}.");

    internal static ProposalView Of(Proposal p) => new(
        p.Id, p.Reference, p.OwnerId, p.Title, p.Description, p.Category, p.RiskClass, p.Status, p.BudgetCycleId, p.Revision,
        [.. p.Versions.OrderBy(v => v.Number).Select(VersionView.Of)]);
}

/// <summary>One version of a proposal's assumptions.</summary>
public sealed record VersionView(int Number, string AuthorId, DateTimeOffset CreatedAt, string Reason, bool IsFrozen,
    DateTimeOffset? FrozenAt, string AssumptionsHash, ProposalAssumptions Assumptions, bool Intact = true)
{
    /// <summary>The version as stored, with whether its assumptions still give their SHA-256 (<see cref="ProposalVersion.Intact"/>).</summary>
    internal static VersionView Of(ProposalVersion v) => new(v.Number, v.AuthorId, v.CreatedAt, v.Reason, v.IsFrozen, v.FrozenAt,
        v.AssumptionsHash, AssumptionsDocument.Deserialize(v.AssumptionsJson), v.Intact);
}
